import type { Request, Response } from 'express';
import { z } from 'zod';
import { Me } from '../../shared/schemas/auth';
import { rateLimit } from 'express-rate-limit';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import {
  Invitation,
  InvitationAcceptBody,
  InvitationCreateBody,
  InvitationPreview,
  InvitationParams,
  InvitationTokenParams,
} from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { open, signedIn, teamRole } from '../auth/access';
import { loadMe } from '../auth/me';
import { actorOf, currentTeam, currentUser, input } from '../http/input';
import { HttpProblem, sendProblem } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import {
  acceptInvitation as accept,
  createInvitation as invite,
  invitationsOf,
  previewInvitation as preview,
  revokeInvitation as revoke,
} from '../teams/invitations';

export function invitationRoutes(api: RouteTable, { db, config, mailer }: AppDeps) {
  // Accepting as an existing user checks a password, so failed attempts are limited like sign-in.
  const acceptLimit = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: config.signInLimitPerWindow,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, res) =>
      sendProblem(res, new HttpProblem(429, 'Too many attempts', 'Too many failed attempts to accept invitations from this address. Wait 15 minutes and try again.'), req.originalUrl),
  });

  api.get('/api/teams/:teamId/invitations', { summary: 'Invitations of the team, newest first', response: z.array(Invitation) }, signedIn, teamRole(CAN.manageMembers), validate({ params: TeamParams }), listInvitations);
  api.post(
    '/api/teams/:teamId/invitations',
    { summary: 'Invite someone by e-mail (replaces a pending invitation to the same address)', status: 201, response: Invitation },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: TeamParams, body: InvitationCreateBody }),
    createInvitation,
  );
  api.delete(
    '/api/teams/:teamId/invitations/:invitationId',
    { summary: 'Revoke a pending invitation', status: 204 },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: InvitationParams }),
    revokeInvitation,
  );
  api.get('/api/invitations/:token', { summary: 'Preview an invitation from its link', response: InvitationPreview }, open, validate({ params: InvitationTokenParams }), previewInvitation);
  api.post(
    '/api/invitations/:token/accept',
    { summary: 'Accept an invitation: join the team (creating the account if needed) and sign in', response: Me },
    open,
    acceptLimit,
    validate({ params: InvitationTokenParams, body: InvitationAcceptBody }),
    acceptInvitation,
  );

  async function listInvitations(_req: Request, res: Response) {
    res.json(await invitationsOf(db, currentTeam(res).id));
  }

  async function createInvitation(_req: Request, res: Response) {
    const { body } = input(res, { params: TeamParams, body: InvitationCreateBody });
    const team = currentTeam(res);
    const view = await invite(db, mailer, { team, actor: actorOf(res), inviterName: currentUser(res).displayName, email: body.email, role: body.role, publicUrl: config.publicUrl });
    res.status(201).json(view);
  }

  async function revokeInvitation(_req: Request, res: Response) {
    const { params } = input(res, { params: InvitationParams });
    await revoke(db, actorOf(res), params.invitationId);
    res.status(204).end();
  }

  async function previewInvitation(_req: Request, res: Response) {
    const { params } = input(res, { params: InvitationTokenParams });
    res.json(await preview(db, params.token));
  }

  async function acceptInvitation(req: Request, res: Response) {
    const { params, body } = input(res, { params: InvitationTokenParams, body: InvitationAcceptBody });
    const userId = await accept(db, params.token, body, async (userId) => {
      // A fresh session id defeats session fixation, as at sign-in.
      await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
      req.session.userId = userId;
      await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
    });
    res.json(await loadMe(db, userId));
  }
}
