import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AutoMarkRun } from '@shared/schemas/auto-mark';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

export function cancelAutoMarkRun(teamId: string, runId: string): Promise<AutoMarkRun> {
  return apiPost<AutoMarkRun>(teamPath(teamId, `/auto-mark-runs/${runId}/cancel`));
}

export function useCancelAutoMarkRun(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => cancelAutoMarkRun(teamId, runId),
    onSuccess: (run) => client.setQueryData(autoMarkKeys.run(teamId, run.id), run),
  });
}
