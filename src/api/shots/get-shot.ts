import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Shot } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { shotKeys } from '@/api/query-keys';

export function fetchShot(teamId: string, shotId: string): Promise<Shot> {
  return apiGet<Shot>(teamPath(teamId, `/shots/${shotId}`));
}

export const shotQuery = (teamId: string, shotId: string) => queryOptions({ queryKey: shotKeys.one(teamId, shotId), queryFn: () => fetchShot(teamId, shotId) });

export function useShot(teamId: string, shotId: string) {
  return useQuery(shotQuery(teamId, shotId));
}
