// Per-team roles and what each may do. The server's role middleware and the
// client's menus both read these lists, so they cannot drift apart.
export const ROLES = ['admin', 'analyst', 'tracker', 'engineer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  analyst: 'Analyst',
  tracker: 'Frame marker',
  engineer: 'Engineer',
  viewer: 'Viewer',
};

export const ROLE_DUTIES: Record<Role, string> = {
  admin: 'Runs the team: members, roles, invitations and everything the others can do.',
  analyst: 'Uploads shot clips, states frame rate and conditions, sets scale, origin and level.',
  tracker: 'Marks the projectile frame by frame.',
  engineer: 'Reviews fits, approves or rejects them, and maintains design presets.',
  viewer: 'Reads everything, changes nothing.',
};

/** Who may do what. Admins are included everywhere on purpose. */
export const CAN = {
  read: ROLES,
  manageMembers: ['admin'],
  editShots: ['admin', 'analyst'],
  /** Launchers and projectiles: the engineers who set presets maintain the kit records too. */
  editEquipment: ['admin', 'analyst', 'engineer'],
  calibrate: ['admin', 'analyst'],
  mark: ['admin', 'analyst', 'tracker'],
  runFits: ['admin', 'analyst', 'engineer'],
  review: ['admin', 'engineer'],
  editPresets: ['admin', 'engineer'],
} as const satisfies Record<string, readonly Role[]>;

export function roleAllows(role: Role, allowed: readonly Role[]): boolean {
  return allowed.includes(role);
}
