import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { invalidateAll } from '@/api/invalidate';
import { invitationKeys, teamKeys } from '@/api/query-keys';

export function revokeInvitation(teamId: string, invitationId: string): Promise<void> {
  return apiDelete<void>(`/api/teams/${teamId}/invitations/${invitationId}`);
}

export function useRevokeInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => revokeInvitation(teamId, invitationId),
    onSettled: () => invalidateAll(queryClient, [invitationKeys.all(teamId), teamKeys.detail(teamId)]),
  });
}
