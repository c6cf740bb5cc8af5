import { z } from 'zod';
import { Uuid } from './common';

export const MailMessageParams = z.object({ messageId: Uuid });

export const MailMessage = z.object({
  id: Uuid,
  teamId: Uuid.nullable(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  kind: z.string().nullable(),
  receivedAt: z.string(),
});
export type MailMessage = z.infer<typeof MailMessage>;

/**
 * A page of stored mail. `fakeMail` is false when real SMTP is configured:
 * then nothing is stored and the list is always empty.
 */
export const MailPage = z.object({
  items: z.array(MailMessage),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  fakeMail: z.boolean(),
});
export type MailPage = z.infer<typeof MailPage>;
