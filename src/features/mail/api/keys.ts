// The team outbox is team-scoped (['teams', teamId, ...], the shared convention),
// so inviting someone refreshes it; my own mail is per person.
export const mailKeys = {
  outbox: (teamId: string, page: number, pageSize: number) => ['teams', teamId, 'outbox', { page, pageSize }] as const,
  mine: () => ['mail', 'mine'] as const,
  minePage: (page: number, pageSize: number) => ['mail', 'mine', { page, pageSize }] as const,
  message: (messageId: string) => ['mail', 'mine', 'message', messageId] as const,
};

export const MAIL_PAGE_SIZE = 20;
