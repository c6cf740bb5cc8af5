import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Series } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function fetchSeriesList(teamId: string): Promise<Series[]> {
  return apiGet<Series[]>(teamPath(teamId, '/series'));
}

export const seriesListQuery = (teamId: string) => queryOptions({ queryKey: recordKeys.seriesList(teamId), queryFn: () => fetchSeriesList(teamId) });

export function useSeriesList(teamId: string) {
  return useQuery(seriesListQuery(teamId));
}
