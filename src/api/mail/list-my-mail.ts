import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MailPage } from '@shared/schemas/mail';
import { apiGet } from '@/lib/api-client';
import { mailKeys } from '@/api/query-keys';

export const MAIL_PAGE_SIZE = 20;

export function fetchMyMail(page: number, pageSize: number): Promise<MailPage> {
  return apiGet<MailPage>(`/api/mail?page=${page}&pageSize=${pageSize}`);
}

export const myMailOptions = (page: number, pageSize: number) =>
  queryOptions({ queryKey: mailKeys.page(page, pageSize), queryFn: () => fetchMyMail(page, pageSize), placeholderData: keepPreviousData });

export function useMyMail(page: number, pageSize: number) {
  return useQuery(myMailOptions(page, pageSize));
}
