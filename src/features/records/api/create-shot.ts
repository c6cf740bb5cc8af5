import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Shot, ShotCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function createShot(teamId: string, body: ShotCreateBody): Promise<Shot> {
  return apiPost<Shot>(teamPath(teamId, '/shots'), body);
}

export function useCreateShot(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ShotCreateBody) => createShot(teamId, body),
    onSuccess: () => client.invalidateQueries({ queryKey: recordKeys.all(teamId) }),
  });
}
