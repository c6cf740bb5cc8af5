import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invitation, InvitationCreateBody } from '@shared/schemas/teams';
import { apiPost } from '@/lib/api-client';
import { invalidateAll } from '@/api/invalidate';
import { invitationKeys, outboxKeys, teamKeys } from '@/api/query-keys';

export function createInvitation(teamId: string, body: InvitationCreateBody): Promise<Invitation> {
  return apiPost<Invitation>(`/api/teams/${teamId}/invitations`, { ...body });
}

/** Also refreshes the team's outbox, which now holds the invitation e-mail. */
export function useCreateInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InvitationCreateBody) => createInvitation(teamId, body),
    onSuccess: () => invalidateAll(queryClient, [invitationKeys.all(teamId), outboxKeys.all(teamId), teamKeys.detail(teamId)]),
  });
}
