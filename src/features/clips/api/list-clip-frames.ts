import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipFrameView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipKeys, clipPath } from './keys';

export function fetchClipFrames(teamId: string, clipId: string): Promise<ClipFrameView[]> {
  return apiGet<ClipFrameView[]>(clipPath(teamId, clipId, '/frames'));
}

export const clipFramesQuery = (teamId: string, clipId: string) =>
  queryOptions({ queryKey: clipKeys.frames(teamId, clipId), queryFn: () => fetchClipFrames(teamId, clipId) });

/** Only asked for once the frames exist (status ready). */
export function useClipFrames(teamId: string, clipId: string, enabled: boolean) {
  return useQuery({ ...clipFramesQuery(teamId, clipId), enabled });
}
