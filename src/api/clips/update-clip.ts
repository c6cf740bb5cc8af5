import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClipPatchBody, ClipView } from '@shared/schemas/clips';
import { apiPatch } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { invalidateClipAndDerived } from './clip-views';

/** A new capture rate recomputes frame times; a new in/out range re-extracts the frames. */
export function updateClip(teamId: string, clipId: string, body: ClipPatchBody): Promise<ClipView> {
  return apiPatch<ClipView>(clipPath(teamId, clipId), body);
}

export function useUpdateClip(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ clipId, body }: { clipId: string; body: ClipPatchBody }) => updateClip(teamId, clipId, body),
    onSuccess: () => invalidateClipAndDerived(client, teamId),
  });
}
