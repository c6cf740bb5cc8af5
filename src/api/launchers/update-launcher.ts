import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Launcher, LauncherCreateBody } from '@shared/schemas/records';
import { apiPatch } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { invalidateRecordViews } from '@/api/invalidate-records';

export function updateLauncher(teamId: string, launcherId: string, body: Partial<LauncherCreateBody>): Promise<Launcher> {
  return apiPatch<Launcher>(teamPath(teamId, `/launchers/${launcherId}`), body);
}

export function useUpdateLauncher(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: Partial<LauncherCreateBody> }) => updateLauncher(teamId, id, body),
    onSuccess: () => invalidateRecordViews(client, teamId),
  });
}
