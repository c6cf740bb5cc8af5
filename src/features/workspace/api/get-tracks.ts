import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TrackList } from '@shared/schemas/marking';
import { apiGet } from '@/lib/api-client';
import { clipBase, workspaceKeys } from './keys';

export const fetchTracks = (teamId: string, clipId: string) => apiGet<TrackList>(`${clipBase(teamId, clipId)}/tracks`);

export const tracksQuery = (teamId: string, clipId: string) =>
  queryOptions({ queryKey: workspaceKeys.tracks(teamId, clipId), queryFn: () => fetchTracks(teamId, clipId) });

export const useTracks = (teamId: string, clipId: string) => useQuery(tracksQuery(teamId, clipId));
