// Every team-scoped key starts with ['teams', teamId], so invalidating that
// prefix refreshes all of one team's cached data (other areas follow the same
// convention for their team-scoped keys).
export const teamKeys = {
  all: ['teams'] as const,
  list: () => ['teams', 'list'] as const,
  detail: (teamId: string) => ['teams', teamId, 'detail'] as const,
};
