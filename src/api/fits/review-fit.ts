import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FitDetail, FitReviewBody } from '@shared/schemas/fits';
import { apiPost } from '@/lib/api-client';
import { fitPath } from '@/api/api-paths';
import { fitKeys } from '@/api/query-keys';
import { invalidateFitViews } from './fit-views';

export function reviewFit(teamId: string, fitId: string, body: FitReviewBody): Promise<FitDetail> {
  return apiPost<FitDetail>(fitPath(teamId, fitId, '/review'), body);
}

export function useReviewFit(teamId: string, fitId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: FitReviewBody) => reviewFit(teamId, fitId, body),
    onSuccess: (fit) => {
      client.setQueryData(fitKeys.fit(teamId, fitId), fit);
      return invalidateFitViews(client, teamId);
    },
  });
}
