// Query keys of automatic marking, in the client's one scheme
// (['teams', teamId, resource, …]; see src/api/query-keys.ts).
export const autoMarkKeys = {
  all: (teamId: string) => ['teams', teamId, 'auto-mark'] as const,
  run: (teamId: string, runId: string) => [...autoMarkKeys.all(teamId), 'run', runId] as const,
  ofTrack: (teamId: string, trackId: string) => [...autoMarkKeys.all(teamId), 'track', trackId] as const,
  settings: (teamId: string) => [...autoMarkKeys.all(teamId), 'settings'] as const,
};
