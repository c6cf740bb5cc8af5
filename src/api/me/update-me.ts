import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me } from '@shared/schemas/auth';
import type { NotificationMode } from '@shared/schemas/notifications';
import { apiPatch } from '@/lib/api-client';
import { meKeys } from '@/api/query-keys';

export interface MeChanges {
  displayName?: string;
  notificationMode?: NotificationMode;
}

export function updateMe(changes: MeChanges): Promise<Me> {
  return apiPatch<Me>('/api/auth/me', { ...changes });
}

/** The answer is the new "me"; it replaces the cache so the top bar shows the new name at once. */
export function useUpdateMe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMe,
    onSuccess: (me) => queryClient.setQueryData(meKeys.me, me),
    onSettled: () => queryClient.invalidateQueries({ queryKey: meKeys.me }),
  });
}
