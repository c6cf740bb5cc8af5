import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Launcher, LauncherCreateBody } from '@shared/schemas/records';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function createLauncher(teamId: string, body: LauncherCreateBody): Promise<Launcher> {
  return apiPost<Launcher>(teamPath(teamId, '/launchers'), body);
}

export function useCreateLauncher(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: LauncherCreateBody) => createLauncher(teamId, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
