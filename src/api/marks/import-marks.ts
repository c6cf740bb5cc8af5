import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarksImportBody, MarksImportResult } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { trackPath } from '@/api/api-paths';
import { invalidateAll } from '@/api/invalidate';
import { fitKeys, markKeys } from '@/api/query-keys';

export const importMarks = (teamId: string, trackId: string, body: MarksImportBody) =>
  apiPost<MarksImportResult>(trackPath(teamId, trackId, '/marks/import'), body);

export function useImportMarks(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ trackId, body }: { trackId: string; body: MarksImportBody }) => importMarks(teamId, trackId, body),
    onSuccess: (_r, { trackId }) => invalidateAll(qc, [markKeys.ofTrack(teamId, trackId), fitKeys.all(teamId)]),
  });
}
