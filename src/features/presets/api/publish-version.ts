import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PresetVersion, PublishVersionBody } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetKeys, presetPath } from './keys';

export function publishVersion(teamId: string, presetId: string, body: PublishVersionBody): Promise<PresetVersion> {
  return apiPost<PresetVersion>(`${presetPath(teamId, presetId)}/versions`, body);
}

export function usePublishVersion(teamId: string, presetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: PublishVersionBody) => publishVersion(teamId, presetId, body),
    // Forecasts and keep-out distances of the latest version change with it.
    onSuccess: () => client.invalidateQueries({ queryKey: presetKeys.all(teamId) }),
  });
}
