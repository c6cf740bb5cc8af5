import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LensProfile } from '@shared/schemas/lens-profiles';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { lensProfileKeys } from '@/api/query-keys';

export function fetchLensProfiles(teamId: string): Promise<LensProfile[]> {
  return apiGet<LensProfile[]>(teamPath(teamId, '/lens-profiles'));
}

export const lensProfilesQuery = (teamId: string) => queryOptions({ queryKey: lensProfileKeys.all(teamId), queryFn: () => fetchLensProfiles(teamId) });

/** The team's lens profiles, by name (every member may read them). */
export function useLensProfiles(teamId: string) {
  return useQuery(lensProfilesQuery(teamId));
}
