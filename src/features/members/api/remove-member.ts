import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { meKeys } from '@/lib/use-me';
import { memberKeys } from './keys';

export function removeMember(teamId: string, userId: string): Promise<void> {
  return apiDelete<void>(`/api/teams/${teamId}/members/${userId}`);
}

export function useRemoveMember(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(teamId, userId),
    onSuccess: async () => {
      await Promise.all([queryClient.invalidateQueries({ queryKey: memberKeys.team(teamId) }), queryClient.invalidateQueries({ queryKey: meKeys.me })]);
    },
  });
}
