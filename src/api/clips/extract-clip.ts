import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClipView } from '@shared/schemas/clips';
import { apiPost } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { invalidateClipStatus } from './clip-views';

/** Queues a fresh extraction of the frames (after a failure, a cancel, or to start over). */
export function extractClip(teamId: string, clipId: string): Promise<ClipView> {
  return apiPost<ClipView>(clipPath(teamId, clipId, '/extract'));
}

export function useExtractClip(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (clipId: string) => extractClip(teamId, clipId),
    onSuccess: () => invalidateClipStatus(client, teamId),
  });
}
