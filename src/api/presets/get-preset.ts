import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PresetDetail } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function fetchPreset(teamId: string, presetId: string): Promise<PresetDetail> {
  return apiGet<PresetDetail>(presetPath(teamId, presetId));
}

export const presetQuery = (teamId: string, presetId: string) =>
  queryOptions({ queryKey: presetKeys.detail(teamId, presetId), queryFn: () => fetchPreset(teamId, presetId) });

export const usePreset = (teamId: string, presetId: string) => useQuery(presetQuery(teamId, presetId));
