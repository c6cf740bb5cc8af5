import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import { meKeys } from '@/api/query-keys';

export function signOut(): Promise<void> {
  return apiPost<void>('/api/auth/sign-out');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      // Drop every cached team's data so the next person at this browser sees none of it.
      queryClient.clear();
      queryClient.setQueryData(meKeys.me, null);
    },
  });
}
