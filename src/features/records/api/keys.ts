import type { ShotListQuery } from '@shared/schemas/records';

// Query keys of the records area. Every mutation invalidates `all(teamId)`:
// a renamed series or launcher shows in the shot list too, and the lists are small.
export const recordKeys = {
  all: (teamId: string) => ['records', teamId] as const,
  seriesList: (teamId: string) => [...recordKeys.all(teamId), 'series', 'list'] as const,
  series: (teamId: string, seriesId: string) => [...recordKeys.all(teamId), 'series', 'one', seriesId] as const,
  shotList: (teamId: string, query: ShotListQuery) => [...recordKeys.all(teamId), 'shots', 'list', query] as const,
  shot: (teamId: string, shotId: string) => [...recordKeys.all(teamId), 'shots', 'one', shotId] as const,
  launchers: (teamId: string) => [...recordKeys.all(teamId), 'launchers'] as const,
  projectiles: (teamId: string) => [...recordKeys.all(teamId), 'projectiles'] as const,
};

export const teamPath = (teamId: string, path: string) => `/api/teams/${teamId}${path}`;
