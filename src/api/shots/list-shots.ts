import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page, Shot, ShotListQuery } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { shotKeys } from '@/api/query-keys';

export function fetchShots(teamId: string, query: ShotListQuery): Promise<Page<Shot>> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  return apiGet<Page<Shot>>(teamPath(teamId, `/shots?${params}`));
}

export const shotListQuery = (teamId: string, query: ShotListQuery) =>
  queryOptions({
    queryKey: shotKeys.list(teamId, query),
    queryFn: () => fetchShots(teamId, query),
    // Clip status changes elsewhere (extraction runs on the server), so refetch on every visit.
    staleTime: 0,
  });

export function useShots(teamId: string, query: ShotListQuery) {
  // The previous page stays on screen while the next one loads, so the table does not flash empty.
  return useQuery({ ...shotListQuery(teamId, query), placeholderData: keepPreviousData });
}
