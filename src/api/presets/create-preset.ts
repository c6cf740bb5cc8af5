import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PresetCreateBody, PresetDetail } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetsPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function createPreset(teamId: string, body: PresetCreateBody): Promise<PresetDetail> {
  return apiPost<PresetDetail>(presetsPath(teamId), body);
}

export function useCreatePreset(teamId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: PresetCreateBody) => createPreset(teamId, body),
    onSuccess: () => client.invalidateQueries({ queryKey: presetKeys.all(teamId) }),
  });
}
