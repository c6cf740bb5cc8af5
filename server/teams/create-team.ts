import { eq, like, or } from 'drizzle-orm';
import type { TeamView } from '../../shared/schemas/teams';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { memberships, teams } from '../db/schema/teams';
import { notFound } from '../http/problem';
import { slugCandidate, slugFromName } from './slug';
import { teamViewFor } from './team-view';

/** Creates a team with a free slug; the creator becomes its admin. Returns the team as the creator sees it. */
export async function createTeam(db: Db, userId: string, body: { name: string; siteName?: string | null }): Promise<TeamView | null> {
  const teamId = await db.transaction(async (tx) => {
    const base = slugFromName(body.name);
    const taken = new Set(
      (await tx.select({ slug: teams.slug }).from(teams).where(or(eq(teams.slug, base), like(teams.slug, `${base}-%`)))).map((r) => r.slug),
    );
    // The pre-read makes the usual case one insert; the conflict check covers a team created meanwhile.
    for (let attempt = 0; ; attempt++) {
      const slug = slugCandidate(base, attempt);
      if (taken.has(slug)) continue;
      const [team] = await tx
        .insert(teams)
        .values({ name: body.name, slug, siteName: body.siteName || null })
        .onConflictDoNothing({ target: teams.slug })
        .returning({ id: teams.id });
      if (!team) continue;
      await tx.insert(memberships).values({ teamId: team.id, userId, role: 'admin' });
      await audit(tx, { teamId: team.id, actorUserId: userId, action: 'team.created', targetType: 'team', targetId: team.id, detail: { name: body.name, slug } });
      return team.id;
    }
  });
  return teamViewFor(db, teamId, userId);
}

/** The team as one member sees it (404 when it is gone). */
export async function showTeam(db: Db, teamId: string, userId: string): Promise<TeamView> {
  const view = await teamViewFor(db, teamId, userId);
  if (!view) throw notFound('No such team.');
  return view;
}
