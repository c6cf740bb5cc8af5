import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Launcher } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function fetchLaunchers(teamId: string): Promise<Launcher[]> {
  return apiGet<Launcher[]>(teamPath(teamId, '/launchers'));
}

export const launchersQuery = (teamId: string) => queryOptions({ queryKey: recordKeys.launchers(teamId), queryFn: () => fetchLaunchers(teamId) });

export function useLaunchers(teamId: string) {
  return useQuery(launchersQuery(teamId));
}
