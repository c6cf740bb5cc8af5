import { and, count, desc, eq, type SQL } from 'drizzle-orm';
import type { PageQuery } from '../../shared/schemas/common';
import type { MailMessage, MailPage } from '../../shared/schemas/mail';
import type { Db } from '../db/client';
import { mailMessages } from '../db/schema/mail-messages';
import { notFound } from '../http/problem';

// Mail is stored only by the local fake SMTP server; with real SMTP these lists stay empty.

/** Reads of the stored mail; `fakeMail` says whether the local fake is the mail server. */
export function outbox(db: Db, fakeMail: boolean) {
  async function mailPage(where: SQL, { page, pageSize }: PageQuery): Promise<MailPage> {
    if (!fakeMail) return { items: [], total: 0, page, pageSize, fakeMail };
    const [rows, [{ total }]] = await Promise.all([
      db
        .select()
        .from(mailMessages)
        .where(where)
        .orderBy(desc(mailMessages.receivedAt), desc(mailMessages.id))
        .limit(pageSize)
        .offset((page - 1) * pageSize),
      db.select({ total: count() }).from(mailMessages).where(where),
    ]);
    return { items: rows.map(toMessage), total, page, pageSize, fakeMail };
  }

  return {
    /** The team's sent mail, newest first. */
    teamPage: (teamId: string, query: PageQuery) => mailPage(eq(mailMessages.teamId, teamId), query),
    /** Mail addressed to one person, newest first. */
    inboxPage: (email: string, query: PageQuery) => mailPage(eq(mailMessages.toAddress, email), query),
    /** One message, only when addressed to `email` (404 otherwise). */
    async message(email: string, messageId: string): Promise<MailMessage> {
      const [row] = fakeMail
        ? await db
            .select()
            .from(mailMessages)
            .where(and(eq(mailMessages.id, messageId), eq(mailMessages.toAddress, email)))
        : [];
      if (!row) throw notFound('No such message in your mail.');
      return toMessage(row);
    },
  };
}

function toMessage(row: typeof mailMessages.$inferSelect): MailMessage {
  return {
    id: row.id,
    teamId: row.teamId,
    from: row.fromAddress,
    to: row.toAddress,
    subject: row.subject,
    text: row.textBody,
    html: row.htmlBody,
    kind: row.kind,
    receivedAt: row.receivedAt.toISOString(),
  };
}
