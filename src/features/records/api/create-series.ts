import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Series, SeriesCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function createSeries(teamId: string, body: SeriesCreateBody): Promise<Series> {
  return apiPost<Series>(teamPath(teamId, '/series'), body);
}

export function useCreateSeries(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: SeriesCreateBody) => createSeries(teamId, body),
    onSuccess: () => client.invalidateQueries({ queryKey: recordKeys.all(teamId) }),
  });
}
