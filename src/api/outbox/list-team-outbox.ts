import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MailPage } from '@shared/schemas/mail';
import { apiGet } from '@/lib/api-client';
import { outboxKeys } from '@/api/query-keys';

export function fetchTeamOutbox(teamId: string, page: number, pageSize: number): Promise<MailPage> {
  return apiGet<MailPage>(`/api/teams/${teamId}/outbox?page=${page}&pageSize=${pageSize}`);
}

export const teamOutboxOptions = (teamId: string, page: number, pageSize: number) =>
  queryOptions({
    queryKey: outboxKeys.page(teamId, page, pageSize),
    queryFn: () => fetchTeamOutbox(teamId, page, pageSize),
    // Keep the current page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });

export function useTeamOutbox(teamId: string, page: number, pageSize: number) {
  return useQuery(teamOutboxOptions(teamId, page, pageSize));
}
