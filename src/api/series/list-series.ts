import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Series } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { seriesKeys } from '@/api/query-keys';

export function fetchSeriesList(teamId: string): Promise<Series[]> {
  return apiGet<Series[]>(teamPath(teamId, '/series'));
}

export const seriesListQuery = (teamId: string) => queryOptions({ queryKey: seriesKeys.list(teamId), queryFn: () => fetchSeriesList(teamId) });

export function useSeriesList(teamId: string) {
  return useQuery(seriesListQuery(teamId));
}
