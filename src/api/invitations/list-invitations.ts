import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invitation } from '@shared/schemas/teams';
import { apiGet } from '@/lib/api-client';
import { invitationKeys } from '@/api/query-keys';

export function fetchInvitations(teamId: string): Promise<Invitation[]> {
  return apiGet<Invitation[]>(`/api/teams/${teamId}/invitations`);
}

// An invitation is used in the invitee's browser: asked again each time the list is shown,
// so 'Waiting' does not linger after someone joined.
export const invitationsQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: invitationKeys.all(teamId), queryFn: () => fetchInvitations(teamId), refetchOnMount: 'always' });

/** Admins only; pass enabled=false for other roles so no 403 is asked for. */
export function useInvitations(teamId: string, enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions(teamId), enabled });
}
