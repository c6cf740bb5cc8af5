import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Member } from '@shared/schemas/teams';
import { apiGet } from '@/lib/api-client';
import { memberKeys } from '@/api/query-keys';

export function fetchMembers(teamId: string): Promise<Member[]> {
  return apiGet<Member[]>(`/api/teams/${teamId}/members`);
}

// People join by following a link in their own browser, which no mutation here knows
// about: the list asks again each time it is shown, so a newcomer is there at once.
export const membersQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: memberKeys.all(teamId), queryFn: () => fetchMembers(teamId), refetchOnMount: 'always' });

export function useMembers(teamId: string) {
  return useQuery(membersQueryOptions(teamId));
}
