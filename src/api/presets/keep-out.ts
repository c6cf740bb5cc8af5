import { queryOptions, useQuery } from '@tanstack/react-query';
import type { KeepOutResponse } from '@shared/schemas/presets';
import { apiGet } from '@/lib/api-client';
import { presetPath } from '@/api/api-paths';
import { presetKeys } from '@/api/query-keys';

export function fetchKeepOut(teamId: string, presetId: string, version?: number): Promise<KeepOutResponse> {
  return apiGet<KeepOutResponse>(`${presetPath(teamId, presetId)}/keep-out${version ? `?version=${version}` : ''}`);
}

export const keepOutQuery = (teamId: string, presetId: string, version?: number) =>
  queryOptions({ queryKey: presetKeys.keepOut(teamId, presetId, version), queryFn: () => fetchKeepOut(teamId, presetId, version) });

export const useKeepOut = (teamId: string, presetId: string, version?: number) => useQuery(keepOutQuery(teamId, presetId, version));
