import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { invalidateClipAndDerived } from './clip-views';

/** Removes the clip, its frames and its files on the server. */
export function deleteClip(teamId: string, clipId: string): Promise<void> {
  return apiDelete<void>(clipPath(teamId, clipId));
}

export function useDeleteClip(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (clipId: string) => deleteClip(teamId, clipId),
    onSuccess: () => invalidateClipAndDerived(client, teamId),
  });
}
