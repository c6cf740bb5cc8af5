import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@shared/schemas/teams';
import { apiGet } from '@/lib/api-client';
import { invitationKeys } from '@/api/query-keys';

export function fetchInvitationPreview(token: string): Promise<InvitationPreview> {
  return apiGet<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`);
}

export const invitationPreviewOptions = (token: string) =>
  queryOptions({ queryKey: invitationKeys.byToken(token), queryFn: () => fetchInvitationPreview(token), staleTime: 0 });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewOptions(token));
}
