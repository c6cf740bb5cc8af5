import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FitDetail } from '@shared/schemas/fits';
import { apiPost } from '@/lib/api-client';
import { invalidateFitViews } from './fit-views';

export function runFit(teamId: string, trackId: string): Promise<FitDetail> {
  return apiPost<FitDetail>(`/api/teams/${teamId}/tracks/${trackId}/fits`);
}

export function useRunFit(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (trackId: string) => runFit(teamId, trackId),
    onSuccess: () => invalidateFitViews(client, teamId),
  });
}
