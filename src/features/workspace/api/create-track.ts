import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Track, TrackCreateBody } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export const createTrack = (teamId: string, clipId: string, body: TrackCreateBody) =>
  apiPost<Track>(`${clipBase(teamId, clipId)}/tracks`, body);

export function useCreateTrack(teamId: string, clipId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: TrackCreateBody) => createTrack(teamId, clipId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: workspaceKeys.tracks(teamId, clipId) }),
  });
}
