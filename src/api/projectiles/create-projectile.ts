import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Projectile, ProjectileCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function createProjectile(teamId: string, body: ProjectileCreateBody): Promise<Projectile> {
  return apiPost<Projectile>(teamPath(teamId, '/projectiles'), body);
}

export function useCreateProjectile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ProjectileCreateBody) => createProjectile(teamId, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
