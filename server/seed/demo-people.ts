import type { Role } from '../../shared/roles';

// The demo scenario is invented: Ollendry Line Works, a small maker of
// compressed-air line-throwing launchers, testing at its Wendlow Flats field.
// E-mail addresses use the reserved .test domain (RFC 2606).
export const DEMO_TEAM = {
  name: 'Ollendry Line Works',
  slug: 'ollendry-line-works',
  siteName: 'Wendlow Flats test field',
} as const;

/** Demo only: printed by `npm start` and stated in README. Never use in production. */
export const DEMO_PASSWORD = 'ollendry-demo-2026';

export const DEMO_PEOPLE: { role: Role; email: string; displayName: string }[] = [
  { role: 'admin', email: 'maren.holt@ollendry.test', displayName: 'Maren Holt' },
  { role: 'analyst', email: 'tomas.reyes@ollendry.test', displayName: 'Tomas Reyes' },
  { role: 'tracker', email: 'ines.varga@ollendry.test', displayName: 'Ines Varga' },
  { role: 'engineer', email: 'dev.okafor@ollendry.test', displayName: 'Dev Okafor' },
  { role: 'viewer', email: 'lou.brandt@ollendry.test', displayName: 'Lou Brandt' },
  // A second engineer, so a fit one engineer ran can be approved by another (separation of duties).
  { role: 'engineer', email: 'sana.quist@ollendry.test', displayName: 'Sana Quist' },
];

/** The first demo person of a role; `demoPeopleOf` lists all of them (there are two engineers). */
export function demoPerson(role: Role) {
  const person = DEMO_PEOPLE.find((p) => p.role === role);
  if (!person) throw new Error(`no demo person for ${role}`);
  return person;
}

export function demoPeopleOf(role: Role) {
  return DEMO_PEOPLE.filter((p) => p.role === role);
}
