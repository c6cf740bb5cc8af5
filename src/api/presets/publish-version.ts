import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PresetVersion, PublishVersionBody } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { invalidateAll } from '@/api/invalidate';
import { fitKeys, presetKeys } from '@/api/query-keys';

export function publishVersion(teamId: string, presetId: string, body: PublishVersionBody): Promise<PresetVersion> {
  return apiPost<PresetVersion>(presetPath(teamId, presetId, '/versions'), body);
}

export function usePublishVersion(teamId: string, presetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: PublishVersionBody) => publishVersion(teamId, presetId, body),
    // Forecasts and keep-out distances of the latest version change with it, and so
    // do the preset comparisons shown on each fit's page.
    onSuccess: () => invalidateAll(client, [presetKeys.all(teamId), fitKeys.all(teamId)]),
  });
}
