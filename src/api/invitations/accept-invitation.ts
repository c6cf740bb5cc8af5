import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me } from '@shared/schemas/auth';
import { apiPost } from '@/lib/api-client';
import { invitationKeys, meKeys } from '@/api/query-keys';

export interface AcceptInvitationBody {
  displayName?: string;
  password: string;
}

export function acceptInvitation(token: string, body: AcceptInvitationBody): Promise<Me> {
  return apiPost<Me>(`/api/invitations/${encodeURIComponent(token)}/accept`, { ...body });
}

/** Accepting signs the person in, so the answer replaces the cached "me". */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => acceptInvitation(token, body),
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(meKeys.me, me);
      void queryClient.invalidateQueries({ queryKey: invitationKeys.byToken(token) });
    },
  });
}
