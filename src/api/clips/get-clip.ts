import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipStatus, ClipView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { clipKeys } from '@/api/query-keys';

/** How often a clip is asked for again while the worker extracts its frames. */
export const CLIP_POLL_INTERVAL_MS = 1000;

/** While the worker has the clip, its progress changes every moment. */
export const isWorking = (status: ClipStatus) => status === 'queued' || status === 'extracting';

export function fetchClip(teamId: string, clipId: string): Promise<ClipView> {
  return apiGet<ClipView>(clipPath(teamId, clipId));
}

export const clipQuery = (teamId: string, clipId: string) =>
  queryOptions({
    queryKey: clipKeys.clip(teamId, clipId),
    queryFn: () => fetchClip(teamId, clipId),
    // Poll while extraction is queued or running; stop when it settles.
    refetchInterval: (query) => (query.state.data && isWorking(query.state.data.status) ? CLIP_POLL_INTERVAL_MS : false),
    staleTime: 0,
  });

export function useClip(teamId: string, clipId: string) {
  return useQuery(clipQuery(teamId, clipId));
}
