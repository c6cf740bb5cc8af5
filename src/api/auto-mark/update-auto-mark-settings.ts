import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AutoMarkSettings } from '@shared/schemas/auto-mark';
import { apiPut } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { autoMarkKeys } from './auto-mark-keys';

export function updateAutoMarkSettings(teamId: string, settings: AutoMarkSettings): Promise<AutoMarkSettings> {
  return apiPut<AutoMarkSettings>(teamPath(teamId, '/auto-mark-settings'), settings);
}

export function useUpdateAutoMarkSettings(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (settings: AutoMarkSettings) => updateAutoMarkSettings(teamId, settings),
    onSuccess: (settings) => client.setQueryData(autoMarkKeys.settings(teamId), settings),
  });
}
