import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Projectile } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function fetchProjectiles(teamId: string): Promise<Projectile[]> {
  return apiGet<Projectile[]>(teamPath(teamId, '/projectiles'));
}

export const projectilesQuery = (teamId: string) => queryOptions({ queryKey: recordKeys.projectiles(teamId), queryFn: () => fetchProjectiles(teamId) });

export function useProjectiles(teamId: string) {
  return useQuery(projectilesQuery(teamId));
}
