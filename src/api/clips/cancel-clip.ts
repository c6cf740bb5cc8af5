import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClipView } from '@shared/schemas/clips';
import { apiPost } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { invalidateClipStatus } from './clip-views';

/** Stops a queued or running extraction; the frames extracted so far are discarded by the server. */
export function cancelClip(teamId: string, clipId: string): Promise<ClipView> {
  return apiPost<ClipView>(clipPath(teamId, clipId, '/cancel'));
}

export function useCancelClip(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (clipId: string) => cancelClip(teamId, clipId),
    onSuccess: () => invalidateClipStatus(client, teamId),
  });
}
