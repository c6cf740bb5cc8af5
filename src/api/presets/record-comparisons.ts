import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RecordedComparisons } from '@shared/schemas/preset-responses';
import { apiPost } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { invalidateAll } from '@/api/invalidate';
import { fitKeys, presetKeys } from '@/api/query-keys';

/** Stores that these fits were checked against this version, so each fit remembers it. */
export function recordComparisons(teamId: string, presetId: string, version: number, fitIds: string[]): Promise<RecordedComparisons> {
  return apiPost<RecordedComparisons>(presetPath(teamId, presetId, `/versions/${version}/comparisons`), { fitIds });
}

export function useRecordComparisons(teamId: string, presetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ version, fitIds }: { version: number; fitIds: string[] }) => recordComparisons(teamId, presetId, version, fitIds),
    // The fits compared now list this version among their preset comparisons.
    onSuccess: () => invalidateAll(client, [presetKeys.detail(teamId, presetId), fitKeys.all(teamId)]),
  });
}
