import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/roles';
import type { Member } from '@shared/schemas/teams';
import { apiPatch } from '@/lib/api-client';
import { invalidateAll } from '@/api/invalidate';
import { meKeys, memberKeys, teamKeys } from '@/api/query-keys';

export function changeMemberRole(teamId: string, userId: string, role: Role): Promise<Member> {
  return apiPatch<Member>(`/api/teams/${teamId}/members/${userId}`, { role });
}

/** Invalidates "me" too: an admin may change their own role, which changes what the shell shows. */
export function useChangeMemberRole(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) => changeMemberRole(teamId, userId, role),
    onSettled: () => invalidateAll(queryClient, [memberKeys.all(teamId), teamKeys.detail(teamId), meKeys.me]),
  });
}
