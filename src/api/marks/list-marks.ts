import { queryOptions, useQueries } from '@tanstack/react-query';
import type { MarksResponse } from '@shared/schemas/marking';
import { apiGet } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { markKeys } from '@/api/query-keys';

export const fetchMarks = (teamId: string, trackId: string) => apiGet<MarksResponse>(trackPath(teamId, trackId, '/marks'));

export const marksQuery = (teamId: string, trackId: string) =>
  queryOptions({
    queryKey: markKeys.ofTrack(teamId, trackId),
    queryFn: () => fetchMarks(teamId, trackId),
    // The editor holds the live copy; refetching under someone's hands would
    // fight their unsaved clicks. Conflicts arrive as 409s instead.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useMarksOfTracks = (teamId: string, trackIds: string[]) =>
  useQueries({ queries: trackIds.map((id) => marksQuery(teamId, id)) });
