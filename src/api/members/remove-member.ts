import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { invalidateAll } from '@/api/invalidate';
import { meKeys, memberKeys, teamKeys } from '@/api/query-keys';

export function removeMember(teamId: string, userId: string): Promise<void> {
  return apiDelete<void>(`/api/teams/${teamId}/members/${userId}`);
}

export function useRemoveMember(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(teamId, userId),
    onSuccess: () => invalidateAll(queryClient, [memberKeys.all(teamId), teamKeys.detail(teamId), meKeys.me]),
  });
}
