import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Launcher, LauncherCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { recordKeys, teamPath } from './keys';

export function createLauncher(teamId: string, body: LauncherCreateBody): Promise<Launcher> {
  return apiPost<Launcher>(teamPath(teamId, '/launchers'), body);
}

export function useCreateLauncher(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: LauncherCreateBody) => createLauncher(teamId, body),
    onSuccess: () => client.invalidateQueries({ queryKey: recordKeys.all(teamId) }),
  });
}
