import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FitDetail } from '@shared/schemas/fits';
import { apiGet } from '@/lib/api-client';
import { fitPath } from '@/api/api-paths';
import { fitKeys } from '@/api/query-keys';

export function fetchFit(teamId: string, fitId: string): Promise<FitDetail> {
  return apiGet<FitDetail>(fitPath(teamId, fitId));
}

export const fitQuery = (teamId: string, fitId: string) =>
  queryOptions({
    queryKey: fitKeys.fit(teamId, fitId),
    queryFn: () => fetchFit(teamId, fitId),
    // Staleness is computed on read: marks may have changed in another tab.
    staleTime: 0,
  });

export const useFit = (teamId: string, fitId: string) => useQuery(fitQuery(teamId, fitId));
