import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Launcher } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { launcherKeys } from '@/api/query-keys';

export function fetchLaunchers(teamId: string): Promise<Launcher[]> {
  return apiGet<Launcher[]>(teamPath(teamId, '/launchers'));
}

export const launchersQuery = (teamId: string) => queryOptions({ queryKey: launcherKeys.all(teamId), queryFn: () => fetchLaunchers(teamId) });

export function useLaunchers(teamId: string) {
  return useQuery(launchersQuery(teamId));
}
