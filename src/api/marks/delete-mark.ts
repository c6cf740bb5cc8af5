import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkDeleteResult, MarksResponse } from '@shared/schemas/marking';
import { apiDelete } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { fitKeys, markKeys } from '@/api/query-keys';
import { withCachedMark } from './put-mark';

export interface DeleteMarkVars {
  trackId: string;
  frameNumber: number;
  expectedRevision: number;
}

export const deleteMark = (teamId: string, { trackId, frameNumber, expectedRevision }: DeleteMarkVars) =>
  apiDelete<MarkDeleteResult>(`${trackPath(teamId, trackId)}/marks/${frameNumber}?expectedRevision=${expectedRevision}`);

/** Removes a mark, optimistically; a failure restores the cached list. */
export function useDeleteMark(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (vars: DeleteMarkVars) => deleteMark(teamId, vars),
    onMutate: async (vars) => {
      const key = markKeys.ofTrack(teamId, vars.trackId);
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<MarksResponse>(key);
      qc.setQueryData<MarksResponse>(key, (d) => withCachedMark(d, vars.frameNumber, null));
      return { before };
    },
    onError: (_err, vars, context) => {
      if (context?.before) qc.setQueryData(markKeys.ofTrack(teamId, vars.trackId), context.before);
    },
    onSuccess: (result, vars) => {
      qc.setQueryData<MarksResponse>(markKeys.ofTrack(teamId, vars.trackId), (d) => (d ? { ...d, trackRevision: result.trackRevision } : d));
      // Fits of this track now report changed inputs.
      void qc.invalidateQueries({ queryKey: fitKeys.all(teamId) });
    },
  });
}
