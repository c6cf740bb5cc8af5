// Team-scoped keys start with ['teams', teamId] (the convention every area
// follows), so invalidating a team prefix also refreshes its member count.
export const memberKeys = {
  team: (teamId: string) => ['teams', teamId] as const,
  list: (teamId: string) => ['teams', teamId, 'members'] as const,
  invitations: (teamId: string) => ['teams', teamId, 'invitations'] as const,
};
