import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Series, SeriesCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function createSeries(teamId: string, body: SeriesCreateBody): Promise<Series> {
  return apiPost<Series>(teamPath(teamId, '/series'), body);
}

export function useCreateSeries(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: SeriesCreateBody) => createSeries(teamId, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
