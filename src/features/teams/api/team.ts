import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/roles';
import { apiGet } from '@/lib/api-client';
import { teamKeys } from './keys';

export interface TeamDetail {
  id: string;
  name: string;
  slug: string;
  siteName: string | null;
  memberCount: number;
  role: Role;
}

export function fetchTeam(teamId: string): Promise<TeamDetail> {
  return apiGet<TeamDetail>(`/api/teams/${teamId}`);
}

export const teamQueryOptions = (teamId: string) => queryOptions({ queryKey: teamKeys.detail(teamId), queryFn: () => fetchTeam(teamId) });

export function useTeam(teamId: string) {
  return useQuery(teamQueryOptions(teamId));
}
