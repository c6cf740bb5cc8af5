import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PresetSummary } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { presetsPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function fetchPresets(teamId: string): Promise<PresetSummary[]> {
  return apiGet<PresetSummary[]>(presetsPath(teamId));
}

export const presetsQuery = (teamId: string) => queryOptions({ queryKey: presetKeys.list(teamId), queryFn: () => fetchPresets(teamId) });

export const usePresets = (teamId: string) => useQuery(presetsQuery(teamId));
