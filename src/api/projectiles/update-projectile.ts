import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Projectile, ProjectileCreateBody } from '@shared/schemas/records';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function updateProjectile(teamId: string, projectileId: string, body: Partial<ProjectileCreateBody>): Promise<Projectile> {
  return apiPatch<Projectile>(teamPath(teamId, `/projectiles/${projectileId}`), body);
}

export function useUpdateProjectile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: Partial<ProjectileCreateBody> }) => updateProjectile(teamId, id, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
