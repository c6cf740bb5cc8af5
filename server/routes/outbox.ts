import type { Request, Response } from 'express';
import { and, count, desc, eq, type SQL } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { PageQuery, TeamParams } from '../../shared/schemas/common';
import { MailMessageParams, type MailMessage, type MailPage } from '../../shared/schemas/mail';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { mailMessages } from '../db/schema/mail-messages';
import { currentTeam, currentUser, input } from '../http/input';
import { notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

// Mail is stored only by the local fake SMTP server; with real SMTP these lists stay empty.
export function outboxRoutes(api: RouteTable, { db, config }: AppDeps) {
  const fakeMail = config.smtpUrl === null;

  api.get(
    '/api/teams/:teamId/outbox',
    "The team's sent mail, newest first (local mail fake only)",
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: TeamParams, query: PageQuery }),
    teamOutbox,
  );
  api.get('/api/mail', 'Mail addressed to me, newest first (local mail fake only)', signedIn, validate({ query: PageQuery }), myMail);
  api.get('/api/mail/:messageId', 'One message addressed to me', signedIn, validate({ params: MailMessageParams }), myMessage);

  async function teamOutbox(_req: Request, res: Response) {
    const { query } = input(res, { query: PageQuery });
    res.json(await mailPage(eq(mailMessages.teamId, currentTeam(res).id), query));
  }

  async function myMail(_req: Request, res: Response) {
    const { query } = input(res, { query: PageQuery });
    res.json(await mailPage(eq(mailMessages.toAddress, currentUser(res).email), query));
  }

  async function myMessage(_req: Request, res: Response) {
    const { params } = input(res, { params: MailMessageParams });
    const [row] = fakeMail
      ? await db
          .select()
          .from(mailMessages)
          .where(and(eq(mailMessages.id, params.messageId), eq(mailMessages.toAddress, currentUser(res).email)))
      : [];
    if (!row) throw notFound('No such message in your mail.');
    res.json(toMessage(row));
  }

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

