import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeamView } from '@shared/schemas/teams';
import { apiGet } from '@/lib/api-client';
import { teamKeys } from '@/api/query-keys';

export function fetchTeam(teamId: string): Promise<TeamView> {
  return apiGet<TeamView>(`/api/teams/${teamId}`);
}

export const teamQueryOptions = (teamId: string) => queryOptions({ queryKey: teamKeys.detail(teamId), queryFn: () => fetchTeam(teamId) });

export function useTeam(teamId: string) {
  return useQuery(teamQueryOptions(teamId));
}
