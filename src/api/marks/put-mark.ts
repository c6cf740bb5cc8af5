import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Mark, MarksResponse, MarkUpsertBody, MarkWriteResult } from '@shared/schemas/marking';
import { apiPut } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { fitKeys, markKeys } from '@/api/query-keys';

export interface PutMarkVars {
  trackId: string;
  frameNumber: number;
  body: MarkUpsertBody;
}

export const putMark = (teamId: string, { trackId, frameNumber, body }: PutMarkVars) =>
  apiPut<MarkWriteResult>(`${trackPath(teamId, trackId)}/marks/${frameNumber}`, body);

/** Puts one mark into a cached MarksResponse (or takes it out with null), keeping frame order. */
export function withCachedMark(data: MarksResponse | undefined, frameNumber: number, mark: Mark | null): MarksResponse | undefined {
  if (!data) return data;
  const marks = data.marks.filter((m) => m.frameNumber !== frameNumber);
  if (mark) marks.push(mark);
  marks.sort((a, b) => a.frameNumber - b.frameNumber);
  return { ...data, marks };
}

/**
 * Saves a mark. Optimistic: the cached list shows it at once; a failure puts
 * the cached list back as it was (the caller also rolls back the editor).
 */
export function usePutMark(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (vars: PutMarkVars) => putMark(teamId, vars),
    onMutate: async (vars) => {
      const key = markKeys.ofTrack(teamId, vars.trackId);
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<MarksResponse>(key);
      // Not saved yet: revision -1 and no server t/x/y (the workspace places it live meanwhile).
      // Asserted rather than annotated so the placeholder stays valid while the
      // stored mark gains fields (who placed it, with what confidence).
      const optimistic = {
        frameNumber: vars.frameNumber,
        uPx: vars.body.uPx,
        vPx: vars.body.vPx,
        placedUPx: vars.body.placedUPx ?? vars.body.uPx,
        placedVPx: vars.body.placedVPx ?? vars.body.vPx,
        snapped: vars.body.snapped ?? false,
        revision: -1,
        updatedBy: null,
        updatedAt: new Date().toISOString(),
        source: vars.body.snapped ? 'snap' : 'hand',
        confidence: null,
        lowConfidenceReason: null,
        tS: null,
        xM: null,
        yM: null,
      } as Mark;
      qc.setQueryData<MarksResponse>(key, (d) => withCachedMark(d, vars.frameNumber, optimistic));
      return { before };
    },
    onError: (_err, vars, context) => {
      if (context?.before) qc.setQueryData(markKeys.ofTrack(teamId, vars.trackId), context.before);
    },
    onSuccess: (result, vars) => {
      qc.setQueryData<MarksResponse>(markKeys.ofTrack(teamId, vars.trackId), (d) =>
        d ? { ...withCachedMark(d, vars.frameNumber, result.mark)!, trackRevision: result.trackRevision } : d,
      );
      // Fits of this track now report changed inputs.
      void qc.invalidateQueries({ queryKey: fitKeys.all(teamId) });
    },
  });
}
