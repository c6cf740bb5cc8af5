import { and, eq, sql } from 'drizzle-orm';
import { ROLES, type Role } from '../../shared/roles';
import type { Member } from '../../shared/schemas/teams';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db, DbOrTx } from '../db/client';
import { memberships } from '../db/schema/teams';
import { users } from '../db/schema/users';
import { lockMembershipForChange, refuseLastAdminLoss } from './admin-guard';

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

async function emailOf(db: DbOrTx, userId: string): Promise<string | null> {
  const [row] = await db.select({ email: users.email }).from(users).where(eq(users.id, userId));
  return row?.email ?? null;
}

/** Changes a member's role; the last admin cannot be demoted. Returns the member as listed. */
export async function changeMemberRole(db: Db, actor: Actor, userId: string, role: Role): Promise<Member | undefined> {
  await db.transaction(async (tx) => {
    const current = await lockMembershipForChange(tx, actor.teamId, userId);
    if (current.role === role) return;
    refuseLastAdminLoss(current, role, 'demoted');
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, actor.teamId), eq(memberships.userId, userId)));
    await audit(tx, {
      teamId: actor.teamId,
      actorUserId: actor.userId,
      action: 'member.role-changed',
      targetType: 'user',
      targetId: userId,
      detail: { from: current.role, to: role, email: await emailOf(tx, userId) },
    });
  });
  return (await membersOf(db, actor.teamId)).find((m) => m.userId === userId);
}

/** Removes a member; the last admin cannot be removed. */
export async function removeMember(db: Db, actor: Actor, userId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const current = await lockMembershipForChange(tx, actor.teamId, userId);
    refuseLastAdminLoss(current, null, 'removed');
    await tx.delete(memberships).where(and(eq(memberships.teamId, actor.teamId), eq(memberships.userId, userId)));
    await audit(tx, {
      teamId: actor.teamId,
      actorUserId: actor.userId,
      action: 'member.removed',
      targetType: 'user',
      targetId: userId,
      detail: { role: current.role, email: await emailOf(tx, userId) },
    });
  });
}
