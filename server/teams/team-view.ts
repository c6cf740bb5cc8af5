import { and, eq, sql } from 'drizzle-orm';
import type { TeamView } from '../../shared/schemas/teams';
import type { Db } from '../db/client';
import { memberships, teams } from '../db/schema/teams';

const memberCount = sql<number>`(select count(*)::int from ${memberships} as m2 where m2.team_id = ${teams.id})`;

function baseQuery(db: Pick<Db, 'select'>) {
  return db
    .select({
      id: teams.id,
      name: teams.name,
      slug: teams.slug,
      siteName: teams.siteName,
      role: memberships.role,
      memberCount,
      createdAt: teams.createdAt,
    })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId));
}

type Row = Omit<TeamView, 'createdAt'> & { createdAt: Date };
const toView = (row: Row): TeamView => ({ ...row, createdAt: row.createdAt.toISOString() });

/** Every team the user belongs to, with their role in it. */
export async function teamsOf(db: Pick<Db, 'select'>, userId: string): Promise<TeamView[]> {
  const rows = await baseQuery(db).where(eq(memberships.userId, userId)).orderBy(teams.name);
  return rows.map(toView);
}

export async function teamViewFor(db: Pick<Db, 'select'>, teamId: string, userId: string): Promise<TeamView | null> {
  const [row] = await baseQuery(db).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  return row ? toView(row) : null;
}
