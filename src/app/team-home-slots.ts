import { CAN } from '@shared/roles';
import type { TeamHomeLink, TeamHomePanel } from '@/features/teams/components/team-home-page';

// What the team home offers, per role. Features add their shortcuts and
// panels here (one entry each); the team home only renders what it is given.
export const TEAM_HOME_LINKS: TeamHomeLink[] = [
  { label: 'Shot results', description: 'Every shot with its latest fit: state, launch speed and Cd.', to: (teamId) => `/t/${teamId}/results` },
  { label: 'Record a shot', description: 'Launcher, projectile and conditions first; the clip follows.', to: (teamId) => `/t/${teamId}/shots/new`, roles: CAN.editShots },
  { label: 'Shots', description: 'Every shot of the team with its clip, marks and fit.', to: (teamId) => `/t/${teamId}/shots` },
  { label: 'Launchers & projectiles', description: 'The kit the team shoots with.', to: (teamId) => `/t/${teamId}/kit` },
  { label: 'Members', description: 'Who is in the team and what each role does.', to: (teamId) => `/t/${teamId}/members` },
  { label: 'Invite people', description: 'Send an invitation by e-mail with a role.', to: (teamId) => `/t/${teamId}/members#invite`, roles: CAN.manageMembers },
  { label: 'Outbox', description: 'Every e-mail Arcbench sent for this team.', to: (teamId) => `/t/${teamId}/outbox`, roles: CAN.manageMembers },
];

export const TEAM_HOME_PANELS: TeamHomePanel[] = [];
