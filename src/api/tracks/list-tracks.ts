import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrackList } from '@shared/schemas/marking';
import { apiGet } from '@/lib/api-client';
import { clipPath } from '@/api/api-paths';
import { trackKeys } from '@/api/query-keys';

export const fetchTracks = (teamId: string, clipId: string) => apiGet<TrackList>(clipPath(teamId, clipId, '/tracks'));

export const tracksQuery = (teamId: string, clipId: string) =>
  queryOptions({ queryKey: trackKeys.ofClip(teamId, clipId), queryFn: () => fetchTracks(teamId, clipId) });

export const useTracks = (teamId: string, clipId: string) => useQuery(tracksQuery(teamId, clipId));
