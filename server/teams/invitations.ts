import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Role } from '../../shared/roles';
import type { Invitation, InvitationPreview } from '../../shared/schemas/teams';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import { hashPassword, verifyPassword } from '../auth/passwords';
import type { Db } from '../db/client';
import { invitations } from '../db/schema/invitations';
import { memberships, teams } from '../db/schema/teams';
import { users } from '../db/schema/users';
import { HttpProblem, badRequest, conflict, notFound, unauthorized } from '../http/problem';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from './invitation-mail';
import { invitationState } from './invitation-state';
import { INVITATION_LIFETIME_MS, hashInvitationToken, newInvitationToken } from './invitation-token';

export interface InviteArgs {
  team: { id: string; name: string };
  actor: Actor;
  inviterName: string;
  email: string;
  role: Role;
  /** Base of the link in the mail (the app's public URL). */
  publicUrl: string;
}

/**
 * Invites someone by e-mail, replacing a pending invitation to the same address.
 * The mail is sent inside the transaction, so a refused mail saves nothing.
 */
export async function createInvitation(db: Db, mailer: Mailer, { team, actor, inviterName, email, role, publicUrl }: InviteArgs): Promise<Invitation | undefined> {
  const body = { email, role };
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
      .values({ teamId: team.id, email: body.email, role: body.role, tokenHash: hashInvitationToken(token), invitedBy: actor.userId, expiresAt })
      .returning({ id: invitations.id });
    await audit(tx, {
      teamId: team.id,
      actorUserId: actor.userId,
      action: 'invitation.sent',
      targetType: 'invitation',
      targetId: created.id,
      detail: { email: body.email, role: body.role, replaced: replaced.map((r) => r.id) },
    });
    // Sent inside the transaction: if the mail server refuses, the invitation is rolled back
    // and the earlier one (if any) stays valid, so the admin can simply try again.
    const link = `${publicUrl.replace(/\/+$/, '')}/invite/${token}`;
    await mailer
      .send(invitationMail({ to: body.email, teamId: team.id, teamName: team.name, siteName: teamRow?.siteName ?? null, inviterName, role: body.role, link, expiresAt }))
      .catch((err: Error) => {
        throw new HttpProblem(502, 'Mail not sent', `The invitation e-mail could not be sent (${err.message}). Nothing was saved; try again.`);
      });
    return created.id;
  });
  return (await invitationsOf(db, team.id)).find((i) => i.id === invitationId);
}

/** Revokes a pending invitation; revoking twice is harmless, an accepted one is a 409. */
export async function revokeInvitation(db: Db, actor: Actor, invitationId: string): Promise<void> {
  const params = { invitationId };
  await db.transaction(async (tx) => {
    const [inv] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, params.invitationId), eq(invitations.teamId, actor.teamId)))
      .for('update');
    if (!inv) throw notFound('No such invitation in this team.');
    if (inv.acceptedAt) throw conflict(`The invitation to ${inv.email} was already accepted; remove the member instead.`, { reason: 'already-accepted' });
    if (inv.revokedAt) return; // revoking twice is harmless
    await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, inv.id));
    await audit(tx, {
      teamId: actor.teamId,
      actorUserId: actor.userId,
      action: 'invitation.revoked',
      targetType: 'invitation',
      targetId: inv.id,
      detail: { email: inv.email, role: inv.role },
    });
  });
}

/** What the invitation link shows before anyone signs in. */
export async function previewInvitation(db: Db, token: string): Promise<InvitationPreview> {
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
    .where(eq(invitations.tokenHash, hashInvitationToken(token)));
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
  return preview;
}

/**
 * Accepts an invitation: joins the team, creating the account when there is none.
 * `signIn` runs inside the transaction, so a session that cannot be stored rolls the acceptance back.
 */
export async function acceptInvitation(
  db: Db,
  token: string,
  body: { password: string; displayName?: string },
  signIn: (userId: string) => Promise<void>,
): Promise<string> {
  const userId = await db.transaction(async (tx) => {
    // The row lock makes the token single-use even when the link is opened twice at once.
    const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashInvitationToken(token))).for('update');
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
    // and the link still works.
    await signIn(userId);
    return userId;
  });
  return userId;
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

export async function invitationsOf(db: Pick<Db, 'select'>, teamId: string): Promise<Invitation[]> {
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
