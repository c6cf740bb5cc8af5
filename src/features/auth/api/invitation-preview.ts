import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/roles';
import { apiGet } from '@/lib/api-client';
import { authKeys } from './keys';

export type InvitationState = 'pending' | 'expired' | 'used' | 'revoked';

export interface InvitationPreview {
  teamName: string;
  email: string;
  role: Role;
  state: InvitationState;
  accountExists: boolean;
}

export function fetchInvitationPreview(token: string): Promise<InvitationPreview> {
  return apiGet<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`);
}

export const invitationPreviewOptions = (token: string) =>
  queryOptions({ queryKey: authKeys.invitation(token), queryFn: () => fetchInvitationPreview(token), staleTime: 0 });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewOptions(token));
}
