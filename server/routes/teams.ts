import type { Request, Response } from 'express';
import { eq, like, or } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { TeamCreateBody } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { memberships, teams } from '../db/schema/teams';
import { currentTeam, currentUser, input } from '../http/input';
import { notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { slugCandidate, slugFromName } from '../teams/slug';
import { teamViewFor, teamsOf } from '../teams/team-view';

export function teamRoutes(api: RouteTable, { db }: AppDeps) {
  api.get('/api/teams', 'My teams, with my role in each', signedIn, listMyTeams);
  api.post('/api/teams', { summary: 'Create a team; the creator becomes its admin', status: 201 }, signedIn, validate({ body: TeamCreateBody }), createTeam);
  api.get('/api/teams/:teamId', 'A team with its member count and my role', signedIn, teamRole(CAN.read), validate({ params: TeamParams }), showTeam);

  async function listMyTeams(_req: Request, res: Response) {
    res.json(await teamsOf(db, currentUser(res).id));
  }

  async function createTeam(_req: Request, res: Response) {
    const { body } = input(res, { body: TeamCreateBody });
    const user = currentUser(res);
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
        await tx.insert(memberships).values({ teamId: team.id, userId: user.id, role: 'admin' });
        await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'team.created', targetType: 'team', targetId: team.id, detail: { name: body.name, slug } });
        return team.id;
      }
    });
    res.status(201).json(await teamViewFor(db, teamId, user.id));
  }

  async function showTeam(_req: Request, res: Response) {
    const view = await teamViewFor(db, currentTeam(res).id, currentUser(res).id);
    if (!view) throw notFound('No such team.');
    res.json(view);
  }
}
