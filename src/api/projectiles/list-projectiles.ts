import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Projectile } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { projectileKeys } from '@/api/query-keys';

export function fetchProjectiles(teamId: string): Promise<Projectile[]> {
  return apiGet<Projectile[]>(teamPath(teamId, '/projectiles'));
}

export const projectilesQuery = (teamId: string) => queryOptions({ queryKey: projectileKeys.all(teamId), queryFn: () => fetchProjectiles(teamId) });

export function useProjectiles(teamId: string) {
  return useQuery(projectilesQuery(teamId));
}
