import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Shot, ShotUpdateBody } from '@shared/schemas/records';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function updateShot(teamId: string, shotId: string, body: ShotUpdateBody): Promise<Shot> {
  return apiPatch<Shot>(teamPath(teamId, `/shots/${shotId}`), body);
}

export function useUpdateShot(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: ShotUpdateBody }) => updateShot(teamId, id, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
