import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Shot, ShotCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function createShot(teamId: string, body: ShotCreateBody): Promise<Shot> {
  return apiPost<Shot>(teamPath(teamId, '/shots'), body);
}

export function useCreateShot(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ShotCreateBody) => createShot(teamId, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
