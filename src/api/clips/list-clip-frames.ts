import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipFrameView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { clipKeys } from '@/api/query-keys';

export async function fetchClipFrames(teamId: string, clipId: string): Promise<ClipFrameView[]> {
  const body = await apiGet<ClipFrameView[] | { frames: ClipFrameView[] }>(clipPath(teamId, clipId, '/frames'));
  return Array.isArray(body) ? body : body.frames;
}

export const clipFramesQuery = (teamId: string, clipId: string) =>
  queryOptions({
    queryKey: clipKeys.frames(teamId, clipId),
    queryFn: () => fetchClipFrames(teamId, clipId),
    // A frame set only changes by re-extraction, which invalidates the clip (and so this) explicitly.
    staleTime: Infinity,
  });

/** Only asked for once the frames exist (status ready). */
export function useClipFrames(teamId: string, clipId: string, enabled: boolean) {
  return useQuery({ ...clipFramesQuery(teamId, clipId), enabled });
}
