import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { PageQuery, TeamParams } from '../../shared/schemas/common';
import { MailMessage, MailMessageParams, MailPage } from '../../shared/schemas/mail';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { outbox } from '../mail/outbox';

export function outboxRoutes(api: RouteTable, { db, config }: AppDeps) {
  // Mail is stored only by the local fake SMTP server; with real SMTP these lists stay empty.
  const mail = outbox(db, config.smtpUrl === null);

  api.get(
    '/api/teams/:teamId/outbox',
    { summary: "The team's sent mail, newest first (local mail fake only)", response: MailPage },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: TeamParams, query: PageQuery }),
    teamOutbox,
  );
  api.get('/api/mail', { summary: 'Mail addressed to me, newest first (local mail fake only)', response: MailPage }, signedIn, validate({ query: PageQuery }), myMail);
  api.get('/api/mail/:messageId', { summary: 'One message addressed to me', response: MailMessage }, signedIn, validate({ params: MailMessageParams }), myMessage);

  async function teamOutbox(_req: Request, res: Response) {
    const { query } = input(res, { query: PageQuery });
    res.json(await mail.teamPage(currentTeam(res).id, query));
  }

  async function myMail(_req: Request, res: Response) {
    const { query } = input(res, { query: PageQuery });
    res.json(await mail.inboxPage(currentUser(res).email, query));
  }

  async function myMessage(_req: Request, res: Response) {
    const { params } = input(res, { params: MailMessageParams });
    res.json(await mail.message(currentUser(res).email, params.messageId));
  }
}
