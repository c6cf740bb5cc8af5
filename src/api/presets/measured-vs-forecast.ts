import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MeasuredVsForecastResponse } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function fetchMeasuredVsForecast(teamId: string, presetId: string, version?: number): Promise<MeasuredVsForecastResponse> {
  return apiGet<MeasuredVsForecastResponse>(`${presetPath(teamId, presetId)}/measured-vs-forecast${version ? `?version=${version}` : ''}`);
}

export const measuredVsForecastQuery = (teamId: string, presetId: string, version?: number) =>
  queryOptions({ queryKey: presetKeys.measured(teamId, presetId, version), queryFn: () => fetchMeasuredVsForecast(teamId, presetId, version) });

export const useMeasuredVsForecast = (teamId: string, presetId: string, version?: number) => useQuery(measuredVsForecastQuery(teamId, presetId, version));
