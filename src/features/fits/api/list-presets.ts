import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PresetSummary } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { fitKeys } from './keys';

export function fetchPresets(teamId: string): Promise<PresetSummary[]> {
  return apiGet<PresetSummary[]>(`/api/teams/${teamId}/presets`);
}

export const presetsQuery = (teamId: string) => queryOptions({ queryKey: fitKeys.presets(teamId), queryFn: () => fetchPresets(teamId) });

export const usePresets = (teamId: string) => useQuery(presetsQuery(teamId));
