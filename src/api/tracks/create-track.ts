import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Track, TrackCreateBody } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { trackKeys } from '@/api/query-keys';

export const createTrack = (teamId: string, clipId: string, body: TrackCreateBody) =>
  apiPost<Track>(clipPath(teamId, clipId, '/tracks'), body);

export function useCreateTrack(teamId: string, clipId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: TrackCreateBody) => createTrack(teamId, clipId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: trackKeys.ofClip(teamId, clipId) }),
  });
}
