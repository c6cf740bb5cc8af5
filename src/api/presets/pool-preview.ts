import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PoolPreview, PoolPreviewBody } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

/** Pools without publishing, so the engineer sees the value and the heterogeneity words first. Stores nothing. */
export function poolPreview(teamId: string, presetId: string, body: PoolPreviewBody): Promise<PoolPreview> {
  return apiPost<PoolPreview>(presetPath(teamId, presetId, '/pool-preview'), body);
}

// Read as a query (it changes nothing) so that reviewing a fit, which
// invalidates every preset key, refreshes a preview already on screen.
export const poolPreviewQuery = (teamId: string, presetId: string, fitIds: readonly string[]) =>
  queryOptions({ queryKey: presetKeys.poolPreview(teamId, presetId, fitIds), queryFn: () => poolPreview(teamId, presetId, { fitIds: [...fitIds] }) });

/** Null asks for nothing: the engineer has not asked to pool the current choice yet. */
export const usePoolPreview = (teamId: string, presetId: string, fitIds: readonly string[] | null) =>
  useQuery({ ...poolPreviewQuery(teamId, presetId, fitIds ?? []), enabled: fitIds !== null });
