import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShotFits } from '@shared/schemas/fits';
import { apiGet } from '@/lib/api-client';
import { fitKeys } from '@/api/query-keys';

export function fetchShotFits(teamId: string, shotId: string): Promise<ShotFits> {
  return apiGet<ShotFits>(`/api/teams/${teamId}/shots/${shotId}/fits`);
}

export const shotFitsQuery = (teamId: string, shotId: string) =>
  queryOptions({ queryKey: fitKeys.shotFits(teamId, shotId), queryFn: () => fetchShotFits(teamId, shotId), staleTime: 0 });

export const useShotFits = (teamId: string, shotId: string) => useQuery(shotFitsQuery(teamId, shotId));
