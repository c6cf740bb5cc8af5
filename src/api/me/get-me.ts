import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '@shared/schemas/auth';
import { ApiError, apiGet } from '@/lib/api-client';
import { meKeys } from '@/api/query-keys';

export type TeamMembership = Me['teams'][number];

/** Null means "signed out": a 401 here is an answer, not an error. */
export async function fetchMe(): Promise<Me | null> {
  try {
    return await apiGet<Me>('/api/auth/me');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.me,
    queryFn: fetchMe,
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}

/** My membership of one team (name, site, role), or undefined when I am not in it. */
export function useMembership(teamId: string | undefined): TeamMembership | undefined {
  const { data } = useMe();
  return teamId ? data?.teams.find((t) => t.id === teamId) : undefined;
}
