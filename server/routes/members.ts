import type { Request, Response } from 'express';
import { and, eq, sql } from 'drizzle-orm';
import { CAN, ROLES } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { MemberParams, MemberRoleBody, type Member } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { memberships } from '../db/schema/teams';
import { users } from '../db/schema/users';
import { currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import type { Db } from '../db/client';
import { lockMembershipForChange, refuseLastAdminLoss } from '../teams/admin-guard';

export function memberRoutes(api: RouteTable, { db }: AppDeps) {
  api.get('/api/teams/:teamId/members', 'Members of the team with their roles', signedIn, teamRole(CAN.read), validate({ params: TeamParams }), listMembers);
  api.patch(
    '/api/teams/:teamId/members/:userId',
    "Change a member's role (the last admin cannot be demoted)",
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: MemberParams, body: MemberRoleBody }),
    changeRole,
  );
  api.delete(
    '/api/teams/:teamId/members/:userId',
    { summary: 'Remove a member (the last admin cannot be removed)', status: 204 },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: MemberParams }),
    removeMember,
  );

  async function listMembers(_req: Request, res: Response) {
    res.json(await membersOf(db, currentTeam(res).id));
  }

  async function changeRole(_req: Request, res: Response) {
    const { params, body } = input(res, { params: MemberParams, body: MemberRoleBody });
    const team = currentTeam(res);
    const actor = currentUser(res);
    await db.transaction(async (tx) => {
      const current = await lockMembershipForChange(tx, team.id, params.userId);
      if (current.role === body.role) return;
      refuseLastAdminLoss(current, body.role, 'demoted');
      await tx
        .update(memberships)
        .set({ role: body.role })
        .where(and(eq(memberships.teamId, team.id), eq(memberships.userId, params.userId)));
      await audit(tx, {
        teamId: team.id,
        actorUserId: actor.id,
        action: 'member.role-changed',
        targetType: 'user',
        targetId: params.userId,
        detail: { from: current.role, to: body.role, email: await emailOf(tx, params.userId) },
      });
    });
    const member = (await membersOf(db, team.id)).find((m) => m.userId === params.userId);
    res.json(member);
  }

  async function removeMember(_req: Request, res: Response) {
    const { params } = input(res, { params: MemberParams });
    const team = currentTeam(res);
    const actor = currentUser(res);
    await db.transaction(async (tx) => {
      const current = await lockMembershipForChange(tx, team.id, params.userId);
      refuseLastAdminLoss(current, null, 'removed');
      await tx.delete(memberships).where(and(eq(memberships.teamId, team.id), eq(memberships.userId, params.userId)));
      await audit(tx, {
        teamId: team.id,
        actorUserId: actor.id,
        action: 'member.removed',
        targetType: 'user',
        targetId: params.userId,
        detail: { role: current.role, email: await emailOf(tx, params.userId) },
      });
    });
    res.status(204).end();
  }
}

// Role order, so admins head the list and viewers end it.
const roleRank = sql`array_position(${sql.raw(`array[${ROLES.map((r) => `'${r}'`).join(',')}]`)}::team_role[], ${memberships.role})`;

export async function membersOf(db: Pick<Db, 'select'>, teamId: string): Promise<Member[]> {
  const rows = await db
    .select({ userId: users.id, email: users.email, displayName: users.displayName, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(roleRank, users.displayName);
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

async function emailOf(db: Pick<Db, 'select'>, userId: string): Promise<string | null> {
  const [row] = await db.select({ email: users.email }).from(users).where(eq(users.id, userId));
  return row?.email ?? null;
}
