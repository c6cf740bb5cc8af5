import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export const fetchClip = (teamId: string, clipId: string) => apiGet<ClipView>(clipBase(teamId, clipId));

export const clipQuery = (teamId: string, clipId: string) =>
  queryOptions({
    queryKey: workspaceKeys.clip(teamId, clipId),
    queryFn: () => fetchClip(teamId, clipId),
    // While frames are still being extracted, look again every two seconds.
    refetchInterval: (q) => (q.state.data && ['queued', 'extracting'].includes(q.state.data.status) ? 2000 : false),
  });

export const useClip = (teamId: string, clipId: string) => useQuery(clipQuery(teamId, clipId));
