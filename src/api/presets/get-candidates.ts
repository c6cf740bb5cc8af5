import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FitCandidate } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function fetchCandidates(teamId: string, presetId: string): Promise<FitCandidate[]> {
  return apiGet<FitCandidate[]>(presetPath(teamId, presetId, '/candidates'));
}

export const candidatesQuery = (teamId: string, presetId: string) =>
  queryOptions({ queryKey: presetKeys.candidates(teamId, presetId), queryFn: () => fetchCandidates(teamId, presetId) });

export const useCandidates = (teamId: string, presetId: string, enabled = true) => useQuery({ ...candidatesQuery(teamId, presetId), enabled });
