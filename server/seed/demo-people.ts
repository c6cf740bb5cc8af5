import type { Role } from '../../shared/roles';

// The demo scenario is invented: Kestrel Line Systems, a small maker of
// compressed-air line-throwing launchers, testing at its Harrow Flats field.
// E-mail addresses use the reserved .test domain (RFC 2606).
export const DEMO_TEAM = {
  name: 'Kestrel Line Systems',
  slug: 'kestrel-line-systems',
  siteName: 'Harrow Flats test field',
} as const;

/** Demo only: printed by `npm start` and stated in README. Never use in production. */
export const DEMO_PASSWORD = 'kestrel-demo-2026';

export const DEMO_PEOPLE: { role: Role; email: string; displayName: string }[] = [
  { role: 'admin', email: 'maren.holt@kestrel.test', displayName: 'Maren Holt' },
  { role: 'analyst', email: 'tomas.reyes@kestrel.test', displayName: 'Tomas Reyes' },
  { role: 'tracker', email: 'ines.varga@kestrel.test', displayName: 'Ines Varga' },
  { role: 'engineer', email: 'dev.okafor@kestrel.test', displayName: 'Dev Okafor' },
  { role: 'viewer', email: 'lou.brandt@kestrel.test', displayName: 'Lou Brandt' },
];

export function demoPerson(role: Role) {
  const person = DEMO_PEOPLE.find((p) => p.role === role);
  if (!person) throw new Error(`no demo person for ${role}`);
  return person;
}
