import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipFrameView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export async function fetchClipFrames(teamId: string, clipId: string): Promise<ClipFrameView[]> {
  const body = await apiGet<ClipFrameView[] | { frames: ClipFrameView[] }>(`${clipBase(teamId, clipId)}/frames`);
  return Array.isArray(body) ? body : body.frames;
}

export const clipFramesQuery = (teamId: string, clipId: string, enabled: boolean) =>
  queryOptions({
    queryKey: workspaceKeys.frames(teamId, clipId),
    queryFn: () => fetchClipFrames(teamId, clipId),
    enabled,
    staleTime: Infinity,
  });

export const useClipFrames = (teamId: string, clipId: string, enabled: boolean) => useQuery(clipFramesQuery(teamId, clipId, enabled));
