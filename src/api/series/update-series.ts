import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Series, SeriesUpdateBody } from '@shared/schemas/records';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function updateSeries(teamId: string, seriesId: string, body: SeriesUpdateBody): Promise<Series> {
  return apiPatch<Series>(teamPath(teamId, `/series/${seriesId}`), body);
}

export function useUpdateSeries(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: SeriesUpdateBody }) => updateSeries(teamId, id, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
