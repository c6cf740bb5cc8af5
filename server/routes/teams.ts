import type { Request, Response } from 'express';
import { z } from 'zod';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { TeamCreateBody, TeamView } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { renewSessionAfterOwnRoleChange } from '../auth/session-guard';
import { currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { createTeam as createTeamFor, showTeam as showTeamTo } from '../teams/create-team';
import { teamsOf } from '../teams/team-view';

export function teamRoutes(api: RouteTable, { db }: AppDeps) {
  api.get('/api/teams', { summary: 'My teams, with my role in each', response: z.array(TeamView) }, signedIn, listMyTeams);
  api.post('/api/teams', { summary: 'Create a team; the creator becomes its admin', status: 201, response: TeamView }, signedIn, validate({ body: TeamCreateBody }), createTeam);
  api.get('/api/teams/:teamId', { summary: 'A team with its member count and my role', response: TeamView }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), showTeam);

  async function listMyTeams(_req: Request, res: Response) {
    res.json(await teamsOf(db, currentUser(res).id));
  }

  async function createTeam(req: Request, res: Response) {
    const { body } = input(res, { body: TeamCreateBody });
    const team = await createTeamFor(db, currentUser(res).id, body);
    await renewSessionAfterOwnRoleChange(db, req);
    res.status(201).json(team);
  }

  async function showTeam(_req: Request, res: Response) {
    res.json(await showTeamTo(db, currentTeam(res).id, currentUser(res).id));
  }
}
