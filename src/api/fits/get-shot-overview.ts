import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ShotOverviewPage, ShotOverviewQuery } from '@shared/schemas/fits';
import { apiGet } from '@/lib/api-client';
import { fitKeys } from '@/api/query-keys';

export function fetchShotOverview(teamId: string, query: ShotOverviewQuery): Promise<ShotOverviewPage> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  return apiGet<ShotOverviewPage>(`/api/teams/${teamId}/shot-overview?${params}`);
}

export const shotOverviewQuery = (teamId: string, query: ShotOverviewQuery) =>
  queryOptions({ queryKey: fitKeys.overview(teamId, query), queryFn: () => fetchShotOverview(teamId, query), staleTime: 0 });

export function useShotOverview(teamId: string, query: ShotOverviewQuery) {
  return useQuery({ ...shotOverviewQuery(teamId, query), placeholderData: keepPreviousData });
}
