import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarksImportBody, MarksImportResult } from '@shared/schemas/marking';
import { apiPost } from '@/lib/api-client';
import { trackBase, workspaceKeys } from './keys';

export const importMarks = (teamId: string, trackId: string, body: MarksImportBody) =>
  apiPost<MarksImportResult>(`${trackBase(teamId, trackId)}/marks/import`, body);

export function useImportMarks(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ trackId, body }: { trackId: string; body: MarksImportBody }) => importMarks(teamId, trackId, body),
    onSuccess: (_r, { trackId }) => qc.invalidateQueries({ queryKey: workspaceKeys.marks(teamId, trackId) }),
  });
}
