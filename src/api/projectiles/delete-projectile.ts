import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

/** The server refuses (409) while other records still depend on it; the problem's detail says which. */
export function deleteProjectile(teamId: string, projectileId: string): Promise<void> {
  return apiDelete<void>(teamPath(teamId, `/projectiles/${projectileId}`));
}

export function useDeleteProjectile(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteProjectile(teamId, id),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
