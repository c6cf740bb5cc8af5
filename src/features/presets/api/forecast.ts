import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ForecastBody, ForecastResponse } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { presetKeys } from './keys';

/** A POST because the conditions are a body, but it changes nothing, so it is read as a query. */
export function fetchForecast(teamId: string, body: ForecastBody): Promise<ForecastResponse> {
  return apiPost<ForecastResponse>(`/api/teams/${teamId}/forecast`, body);
}

export const forecastQuery = (teamId: string, body: ForecastBody) =>
  queryOptions({ queryKey: presetKeys.forecast(teamId, body), queryFn: () => fetchForecast(teamId, body), placeholderData: keepPreviousData });

export const useForecast = (teamId: string, body: ForecastBody | null) => useQuery({ ...forecastQuery(teamId, body ?? ({} as ForecastBody)), enabled: body !== null });
