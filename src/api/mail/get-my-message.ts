import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailMessage } from '@shared/schemas/mail';
import { apiGet } from '@/lib/api-client';
import { mailKeys } from '@/api/query-keys';

export function fetchMyMessage(messageId: string): Promise<MailMessage> {
  return apiGet<MailMessage>(`/api/mail/${messageId}`);
}

export const myMessageOptions = (messageId: string) => queryOptions({ queryKey: mailKeys.message(messageId), queryFn: () => fetchMyMessage(messageId) });

/** A message opened from a link (?message=…) that is not on the current page of the list. */
export function useMyMessage(messageId: string | null, enabled: boolean) {
  return useQuery({ ...myMessageOptions(messageId ?? ''), enabled: enabled && messageId !== null });
}
