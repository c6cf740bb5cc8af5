import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AutoMarkRun, AutoMarkState } from '@shared/schemas/auto-mark';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

/** How often a run at work is asked for again (its marks are fetched on the same beat). */
export const AUTO_MARK_POLL_MS = 700;

export const isRunAtWork = (state: AutoMarkState) => state === 'queued' || state === 'running';

export function fetchAutoMarkRun(teamId: string, runId: string): Promise<AutoMarkRun> {
  return apiGet<AutoMarkRun>(teamPath(teamId, `/auto-mark-runs/${runId}`));
}

export const autoMarkRunQuery = (teamId: string, runId: string) =>
  queryOptions({
    queryKey: autoMarkKeys.run(teamId, runId),
    queryFn: () => fetchAutoMarkRun(teamId, runId),
    refetchInterval: (query) => (query.state.data && !isRunAtWork(query.state.data.state) ? false : AUTO_MARK_POLL_MS),
    staleTime: 0,
  });

export function useAutoMarkRun(teamId: string, runId: string | null) {
  return useQuery({ ...autoMarkRunQuery(teamId, runId ?? ''), enabled: runId !== null });
}
