import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { TeamSettings, TeamSettingsBody } from '../../shared/schemas/team-settings';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { teamSettings, updateTeamSettings } from '../teams/team-settings';

/** Team-wide rules: everyone reads them (the fit page explains them), admins change them. */
export function teamSettingsRoutes(api: RouteTable, { db }: AppDeps) {
  const path = '/api/teams/:teamId/settings';
  api.get(path, { summary: "The team's rules (separation of duties)", response: TeamSettings }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), show);
  api.patch(path, { summary: "Change the team's rules", response: TeamSettings }, signedIn, teamRole(CAN.manageMembers), validate({ params: TeamParams, body: TeamSettingsBody }), change);

  async function show(_req: Request, res: Response) {
    res.json(await teamSettings(db, currentTeam(res).id));
  }

  async function change(_req: Request, res: Response) {
    const { body } = input(res, { params: TeamParams, body: TeamSettingsBody });
    res.json(await updateTeamSettings(db, actorOf(res), body));
  }
}
