import { and, asc, eq } from 'drizzle-orm';
import type { Role } from '../../shared/roles';
import type { Tx } from '../db/client';
import { memberships } from '../db/schema/teams';
import { conflict, notFound } from '../http/problem';

/**
 * Locks the team's admin memberships, then the target's, inside `tx`.
 * Two concurrent demotions both lock the admin rows first (same order), so the
 * second waits for the first to commit; under READ COMMITTED PostgreSQL then
 * re-checks `role = 'admin'` on the rows it waited for, sees one admin fewer,
 * and refuses — the team can never end up without an admin.
 */
export async function lockMembershipForChange(tx: Tx, teamId: string, userId: string) {
  const admins = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'admin')))
    .orderBy(asc(memberships.userId))
    .for('update');
  const [target] = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .for('update');
  if (!target) throw notFound('That person is not a member of this team.');
  return { role: target.role as Role, adminCount: admins.length };
}

/** Throws 409 when taking `role` away from the target would leave the team without an admin. */
export function refuseLastAdminLoss(current: { role: Role; adminCount: number }, nextRole: Role | null, verb: 'removed' | 'demoted') {
  if (current.role === 'admin' && nextRole !== 'admin' && current.adminCount <= 1) {
    throw conflict(
      `The last admin cannot be ${verb}: every team needs at least one admin. Make another member admin first.`,
      { reason: 'last-admin' },
    );
  }
}
