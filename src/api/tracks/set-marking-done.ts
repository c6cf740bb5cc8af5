import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkingDoneBody, Track } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { trackKeys, workQueueKeys } from '@/api/query-keys';

export const setMarkingDone = (teamId: string, trackId: string, body: MarkingDoneBody) => apiPost<Track>(trackPath(teamId, trackId, '/marking-done'), body);

export function useSetMarkingDone(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ trackId, done }: { trackId: string; done: boolean }) => setMarkingDone(teamId, trackId, { done }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: trackKeys.all(teamId) }), qc.invalidateQueries({ queryKey: workQueueKeys.all(teamId) })]),
  });
}
