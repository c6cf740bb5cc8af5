import type { Request, Response } from 'express';
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { rateLimit } from 'express-rate-limit';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import {
  InvitationAcceptBody,
  InvitationCreateBody,
  InvitationParams,
  InvitationTokenParams,
  type Invitation,
  type InvitationPreview,
} from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { open, signedIn, teamRole } from '../auth/access';
import { loadMe } from '../auth/me';
import { hashPassword, verifyPassword } from '../auth/passwords';
import type { Db } from '../db/client';
import { invitations } from '../db/schema/invitations';
import { memberships, teams } from '../db/schema/teams';
import { users } from '../db/schema/users';
import { currentTeam, currentUser, input } from '../http/input';
import { HttpProblem, badRequest, conflict, notFound, sendProblem, unauthorized } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { invitationMail } from '../teams/invitation-mail';
import { invitationState } from '../teams/invitation-state';
import { INVITATION_LIFETIME_MS, hashInvitationToken, newInvitationToken } from '../teams/invitation-token';

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

  api.get('/api/teams/:teamId/invitations', 'Invitations of the team, newest first', signedIn, teamRole(CAN.manageMembers), validate({ params: TeamParams }), listInvitations);
  api.post(
    '/api/teams/:teamId/invitations',
    { summary: 'Invite someone by e-mail (replaces a pending invitation to the same address)', status: 201 },
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
  api.get('/api/invitations/:token', 'Preview an invitation from its link', open, validate({ params: InvitationTokenParams }), previewInvitation);
  api.post(
    '/api/invitations/:token/accept',
    'Accept an invitation: join the team (creating the account if needed) and sign in',
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
    const actor = currentUser(res);
    const [member] = await db
      .select({ userId: users.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, team.id), eq(users.email, body.email)));
    if (member) throw conflict(`${body.email} is already a member of ${team.name}.`, { reason: 'already-member' });

    const token = newInvitationToken();
    const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
    const [teamRow] = await db.select({ siteName: teams.siteName }).from(teams).where(eq(teams.id, team.id));
    const invitationId = await db.transaction(async (tx) => {
      // Serialises invitations to one address in one team, so only one stays pending.
      await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`invitation:${team.id}:${body.email}`}))`);
      const replaced = await tx
        .update(invitations)
        .set({ revokedAt: new Date() })
        .where(and(eq(invitations.teamId, team.id), eq(invitations.email, body.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
        .returning({ id: invitations.id });
      const [created] = await tx
        .insert(invitations)
        .values({ teamId: team.id, email: body.email, role: body.role, tokenHash: hashInvitationToken(token), invitedBy: actor.id, expiresAt })
        .returning({ id: invitations.id });
      await audit(tx, {
        teamId: team.id,
        actorUserId: actor.id,
        action: 'invitation.sent',
        targetType: 'invitation',
        targetId: created.id,
        detail: { email: body.email, role: body.role, replaced: replaced.map((r) => r.id) },
      });
      // Sent inside the transaction: if the mail server refuses, the invitation is rolled back
      // and the earlier one (if any) stays valid, so the admin can simply try again.
      const link = `${config.publicUrl.replace(/\/+$/, '')}/invite/${token}`;
      await mailer
        .send(invitationMail({ to: body.email, teamId: team.id, teamName: team.name, siteName: teamRow?.siteName ?? null, inviterName: actor.displayName, role: body.role, link, expiresAt }))
        .catch((err: Error) => {
          throw new HttpProblem(502, 'Mail not sent', `The invitation e-mail could not be sent (${err.message}). Nothing was saved; try again.`);
        });
      return created.id;
    });
    const view = (await invitationsOf(db, team.id)).find((i) => i.id === invitationId);
    res.status(201).json(view);
  }

  async function revokeInvitation(_req: Request, res: Response) {
    const { params } = input(res, { params: InvitationParams });
    const team = currentTeam(res);
    await db.transaction(async (tx) => {
      const [inv] = await tx
        .select()
        .from(invitations)
        .where(and(eq(invitations.id, params.invitationId), eq(invitations.teamId, team.id)))
        .for('update');
      if (!inv) throw notFound('No such invitation in this team.');
      if (inv.acceptedAt) throw conflict(`The invitation to ${inv.email} was already accepted; remove the member instead.`, { reason: 'already-accepted' });
      if (inv.revokedAt) return; // revoking twice is harmless
      await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, inv.id));
      await audit(tx, {
        teamId: team.id,
        actorUserId: currentUser(res).id,
        action: 'invitation.revoked',
        targetType: 'invitation',
        targetId: inv.id,
        detail: { email: inv.email, role: inv.role },
      });
    });
    res.status(204).end();
  }

  async function previewInvitation(_req: Request, res: Response) {
    const { params } = input(res, { params: InvitationTokenParams });
    const [row] = await db
      .select({
        teamName: teams.name,
        siteName: teams.siteName,
        email: invitations.email,
        role: invitations.role,
        expiresAt: invitations.expiresAt,
        acceptedAt: invitations.acceptedAt,
        revokedAt: invitations.revokedAt,
        accountId: users.id,
      })
      .from(invitations)
      .innerJoin(teams, eq(teams.id, invitations.teamId))
      .leftJoin(users, eq(users.email, invitations.email))
      .where(eq(invitations.tokenHash, hashInvitationToken(params.token)));
    if (!row) throw notFound(UNKNOWN_LINK);
    const preview: InvitationPreview = {
      teamName: row.teamName,
      siteName: row.siteName,
      email: row.email,
      role: row.role,
      state: invitationState(row),
      expiresAt: row.expiresAt.toISOString(),
      accountExists: row.accountId !== null,
    };
    res.json(preview);
  }

  async function acceptInvitation(req: Request, res: Response) {
    const { params, body } = input(res, { params: InvitationTokenParams, body: InvitationAcceptBody });
    const userId = await db.transaction(async (tx) => {
      // The row lock makes the token single-use even when the link is opened twice at once.
      const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashInvitationToken(params.token))).for('update');
      if (!inv) throw notFound(UNKNOWN_LINK);
      refuseUnusable(inv);

      const [existing] = await tx.select({ id: users.id, passwordHash: users.passwordHash }).from(users).where(eq(users.email, inv.email));
      let userId: string;
      let createdAccount = false;
      if (existing) {
        if (!(await verifyPassword(existing.passwordHash, body.password))) {
          throw unauthorized(`That is not the password of the Arcbench account for ${inv.email}.`);
        }
        userId = existing.id;
      } else {
        if (!body.displayName) {
          throw badRequest('Choose the name your team will see.', { errors: [{ path: 'body.displayName', message: 'is required for a new account' }] });
        }
        const [created] = await tx
          .insert(users)
          .values({ email: inv.email, displayName: body.displayName, passwordHash: await hashPassword(body.password) })
          .onConflictDoNothing({ target: users.email })
          .returning({ id: users.id });
        if (!created) throw conflict(`An account for ${inv.email} was created meanwhile; open the link again and give its password.`);
        userId = created.id;
        createdAccount = true;
      }

      const [membership] = await tx
        .insert(memberships)
        .values({ teamId: inv.teamId, userId, role: inv.role })
        .onConflictDoNothing()
        .returning({ userId: memberships.userId });
      if (!membership) throw conflict(`${inv.email} is already a member of this team.`, { reason: 'already-member' });
      await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
      await audit(tx, {
        teamId: inv.teamId,
        actorUserId: userId,
        action: 'invitation.accepted',
        targetType: 'invitation',
        targetId: inv.id,
        detail: { email: inv.email, role: inv.role, createdAccount },
      });
      // Signing in inside the transaction: if the session cannot be stored, the acceptance rolls back
      // and the link still works. A fresh session id defeats session fixation, as at sign-in.
      await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
      req.session.userId = userId;
      await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
      return userId;
    });
    res.json(await loadMe(db, userId));
  }
}

const UNKNOWN_LINK = 'This invitation link is not valid. Check that it was copied whole, or ask the team admin for a new one.';

/** 410 with a machine-readable reason, so the accept page can say what happened. */
const goneBecause = (reason: 'revoked' | 'used' | 'expired', detail: string) => new HttpProblem(410, 'Invitation no longer valid', detail, { reason });

function refuseUnusable(inv: { expiresAt: Date; acceptedAt: Date | null; revokedAt: Date | null }) {
  switch (invitationState(inv)) {
    case 'revoked':
      throw goneBecause('revoked', 'This invitation was withdrawn by the team admin. Ask them for a new one.');
    case 'used':
      throw goneBecause('used', 'This invitation has already been used. Sign in instead, or ask the team admin for a new one.');
    case 'expired':
      throw goneBecause('expired', `This invitation expired on ${inv.expiresAt.toISOString().slice(0, 10)}. Ask the team admin for a new one.`);
    case 'pending':
      return;
  }
}

const inviter = alias(users, 'inviter');

async function invitationsOf(db: Pick<Db, 'select'>, teamId: string): Promise<Invitation[]> {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: inviter.displayName,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(eq(invitations.teamId, teamId))
    .orderBy(desc(invitations.createdAt))
    .limit(500);
  return rows.map((r) => ({
    ...r,
    state: invitationState(r),
    expiresAt: r.expiresAt.toISOString(),
    acceptedAt: r.acceptedAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  }));
}
