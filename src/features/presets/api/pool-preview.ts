import { useMutation } from '@tanstack/react-query';
import type { PoolPreview, PoolPreviewBody } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetPath } from './keys';

/** Pools without publishing, so the engineer sees the value and the heterogeneity words first. Stores nothing. */
export function poolPreview(teamId: string, presetId: string, body: PoolPreviewBody): Promise<PoolPreview> {
  return apiPost<PoolPreview>(`${presetPath(teamId, presetId)}/pool-preview`, body);
}

export const usePoolPreview = (teamId: string, presetId: string) => useMutation({ mutationFn: (body: PoolPreviewBody) => poolPreview(teamId, presetId, body) });
