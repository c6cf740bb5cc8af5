import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

/** The server refuses (409) while other records still depend on it; the problem's detail says which. */
export function deleteShot(teamId: string, shotId: string): Promise<void> {
  return apiDelete<void>(teamPath(teamId, `/shots/${shotId}`));
}

export function useDeleteShot(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteShot(teamId, id),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
