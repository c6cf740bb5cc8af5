import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ForecastBody, ForecastResponse } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

/** A POST because the conditions are a body, but it changes nothing, so it is read as a query. */
export function fetchForecast(teamId: string, body: ForecastBody): Promise<ForecastResponse> {
  return apiPost<ForecastResponse>(teamPath(teamId, '/forecast'), body);
}

// The same body gives the same answer until a preset publishes a new version,
// which invalidates every preset key (this one included).
export const forecastQuery = (teamId: string, body: ForecastBody) =>
  queryOptions({ queryKey: presetKeys.forecast(teamId, body), queryFn: () => fetchForecast(teamId, body), staleTime: Infinity });

/** Null asks for nothing yet. `keepPrevious` keeps the last answer on screen while new conditions load. */
export const useForecast = (teamId: string, body: ForecastBody | null, { keepPrevious = false } = {}) =>
  useQuery({
    ...forecastQuery(teamId, body ?? ({} as ForecastBody)),
    enabled: body !== null,
    placeholderData: keepPrevious ? keepPreviousData : undefined,
  });
