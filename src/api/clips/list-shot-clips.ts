import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClipView } from '@shared/schemas/clips';
import { apiGet } from '@/lib/api-client';
import { clipKeys } from '@/api/query-keys';

export function fetchShotClips(teamId: string, shotId: string): Promise<ClipView[]> {
  return apiGet<ClipView[]>(`/api/teams/${teamId}/shots/${shotId}/clips`);
}

export const shotClipsQuery = (teamId: string, shotId: string) =>
  queryOptions({ queryKey: clipKeys.shotClips(teamId, shotId), queryFn: () => fetchShotClips(teamId, shotId) });

export function useShotClips(teamId: string, shotId: string) {
  return useQuery(shotClipsQuery(teamId, shotId));
}
