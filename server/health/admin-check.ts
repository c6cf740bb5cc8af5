import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { memberships } from '../db/schema/teams';

/** Whether the user is an admin of at least one team (who may see the detailed health check). */
export async function isAdminOfAnyTeam(db: Db, userId: string | undefined): Promise<boolean> {
  if (!userId) return false;
  const [row] = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.role, 'admin')))
    .limit(1);
  return Boolean(row);
}
