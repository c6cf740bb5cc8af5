import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ForecastBody, ForecastResponse } from '@shared/schemas/presets';
import { apiPost } from '@/lib/api-client';
import { fitKeys } from './keys';

/** A forecast changes nothing on the server (POST only because it takes a body), so it is read as a query. */
export function fetchForecast(teamId: string, body: ForecastBody): Promise<ForecastResponse> {
  return apiPost<ForecastResponse>(`/api/teams/${teamId}/forecast`, body);
}

export const forecastQuery = (teamId: string, body: ForecastBody | null) =>
  queryOptions({
    queryKey: fitKeys.forecast(teamId, body ?? {}),
    queryFn: () => fetchForecast(teamId, body!),
    enabled: body !== null,
    staleTime: Infinity,
  });

export const useForecast = (teamId: string, body: ForecastBody | null) => useQuery(forecastQuery(teamId, body));
