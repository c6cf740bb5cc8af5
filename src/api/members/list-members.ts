import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Member } from '@shared/schemas/teams';
import { apiGet } from '@/lib/api-client';
import { memberKeys } from '@/api/query-keys';

export function fetchMembers(teamId: string): Promise<Member[]> {
  return apiGet<Member[]>(`/api/teams/${teamId}/members`);
}

export const membersQueryOptions = (teamId: string) => queryOptions({ queryKey: memberKeys.all(teamId), queryFn: () => fetchMembers(teamId) });

export function useMembers(teamId: string) {
  return useQuery(membersQueryOptions(teamId));
}
