import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, SignInBody } from '@shared/schemas/auth';
import { apiPost } from '@/lib/api-client';
import { meKeys } from '@/api/query-keys';

export function signIn(body: SignInBody): Promise<Me> {
  return apiPost<Me>('/api/auth/sign-in', body);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      // Anything cached belonged to whoever was signed in before.
      queryClient.clear();
      queryClient.setQueryData(meKeys.me, me);
    },
  });
}
