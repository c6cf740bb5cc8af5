import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipStatus, ClipView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipKeys, clipPath } from './keys';

/** While the worker has the clip, its progress changes every moment. */
export const isWorking = (status: ClipStatus) => status === 'queued' || status === 'extracting';

export function fetchClip(teamId: string, clipId: string): Promise<ClipView> {
  return apiGet<ClipView>(clipPath(teamId, clipId));
}

export const clipQuery = (teamId: string, clipId: string) =>
  queryOptions({
    queryKey: clipKeys.clip(teamId, clipId),
    queryFn: () => fetchClip(teamId, clipId),
    // Poll once a second while extraction is queued or running; stop when it settles.
    refetchInterval: (query) => (query.state.data && isWorking(query.state.data.status) ? 1000 : false),
    staleTime: 0,
  });

export function useClip(teamId: string, clipId: string) {
  return useQuery(clipQuery(teamId, clipId));
}
