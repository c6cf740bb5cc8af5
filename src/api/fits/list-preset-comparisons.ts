import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FitPresetComparison } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { fitPath } from '@/api/api-paths';
import { fitKeys } from '@/api/query-keys';

export function fetchPresetComparisons(teamId: string, fitId: string): Promise<FitPresetComparison[]> {
  return apiGet<FitPresetComparison[] | { comparisons: FitPresetComparison[] }>(fitPath(teamId, fitId, '/preset-comparisons')).then((b) =>
    Array.isArray(b) ? b : b.comparisons,
  );
}

export const presetComparisonsQuery = (teamId: string, fitId: string) =>
  queryOptions({ queryKey: fitKeys.presetComparisons(teamId, fitId), queryFn: () => fetchPresetComparisons(teamId, fitId) });

export const usePresetComparisons = (teamId: string, fitId: string) => useQuery(presetComparisonsQuery(teamId, fitId));
