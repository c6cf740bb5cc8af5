import { CAN, type Role } from '@shared/roles';

/** One entry of the team navigation in the shell's side bar. */
export interface NavEntry {
  label: string;
  /** Where it goes inside the current team. */
  to: (teamId: string) => string;
  /** Only these roles see the entry; everyone in the team when left out. */
  roles?: readonly Role[];
  /** Highlight only on an exact match (for the team home, which prefixes every team page). */
  end?: boolean;
  /** 'team' puts running-the-team pages under their own heading; work pages leave it out. */
  section?: 'work' | 'team';
}

// Features append their entries here (one line each, in reading order of the
// team's work: records → clips → marking → fits → presets → team admin).
export const NAV_ENTRIES: NavEntry[] = [
  { label: 'Team home', to: (teamId) => `/t/${teamId}`, end: true },
  { label: 'Shots', to: (teamId) => `/t/${teamId}/shots` },
  { label: 'Series', to: (teamId) => `/t/${teamId}/series` },
  { label: 'Launchers & projectiles', to: (teamId) => `/t/${teamId}/kit` },
  { label: 'Shot results', to: (teamId) => `/t/${teamId}/results` },
  { label: 'Presets', to: (teamId) => `/t/${teamId}/presets` },
  { label: 'Forecast', to: (teamId) => `/t/${teamId}/forecast` },
  { label: 'Members', to: (teamId) => `/t/${teamId}/members`, section: 'team' },
  { label: 'Outbox', to: (teamId) => `/t/${teamId}/outbox`, roles: CAN.manageMembers, section: 'team' },
];

export function navEntriesFor(role: Role): NavEntry[] {
  return NAV_ENTRIES.filter((entry) => !entry.roles || entry.roles.includes(role));
}
