import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AutoMarkRunList } from '@shared/schemas/auto-mark';
import { apiGet } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

/** Runs of a track, newest first: the workspace picks up a run still at work when it opens. */
export function fetchTrackAutoMarkRuns(teamId: string, trackId: string): Promise<AutoMarkRunList> {
  return apiGet<AutoMarkRunList>(trackPath(teamId, trackId, '/auto-mark-runs'));
}

export const trackAutoMarkRunsQuery = (teamId: string, trackId: string) =>
  queryOptions({ queryKey: autoMarkKeys.ofTrack(teamId, trackId), queryFn: () => fetchTrackAutoMarkRuns(teamId, trackId) });

export function useTrackAutoMarkRuns(teamId: string, trackId: string | null) {
  return useQuery({ ...trackAutoMarkRunsQuery(teamId, trackId ?? ''), enabled: trackId !== null });
}
