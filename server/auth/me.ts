import { eq } from 'drizzle-orm';
import type { Me } from '../../shared/schemas/auth';
import type { Db } from '../db/client';
import { memberships, teams } from '../db/schema/teams';
import { users } from '../db/schema/users';

export async function loadMe(db: Db, userId: string): Promise<Me | null> {
  const [user] = await db.select().from(users).where(eq(users.id, userId));
  if (!user) return null;
  const rows = await db
    .select({ id: teams.id, name: teams.name, slug: teams.slug, siteName: teams.siteName, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(teams.name);
  return { id: user.id, email: user.email, displayName: user.displayName, notificationMode: user.notificationMode, teams: rows };
}
