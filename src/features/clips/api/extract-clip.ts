import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClipView } from '@shared/schemas/clips';
import { apiPost } from '@/lib/api-client';
import { clipKeys, clipPath } from './keys';

/** Queues a fresh extraction of the frames (after a failure, a cancel, or to start over). */
export function extractClip(teamId: string, clipId: string): Promise<ClipView> {
  return apiPost<ClipView>(clipPath(teamId, clipId, '/extract'));
}

export function useExtractClip(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (clipId: string) => extractClip(teamId, clipId),
    onSuccess: () => client.invalidateQueries({ queryKey: clipKeys.all(teamId) }),
  });
}
