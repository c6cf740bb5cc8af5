import type { Request, Response } from 'express';
import { and, asc, count, eq, getTableColumns } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { LauncherCreateBody, LauncherParams, LauncherUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { launchers, shots } from '../db/schema/records';
import { designPresets } from '../db/schema/presets';
import { currentTeam, currentUser, input } from '../http/input';
import { conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

// Engineers maintain launchers as well as analysts: presets and keep-out distances depend on them.
const EDIT_LAUNCHERS = CAN.editEquipment;

/** Launchers the team fires. A launcher still named by shots cannot be deleted (409), so no shot silently loses it. */
export function launcherRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/launchers';
  api.get(base, 'List the team’s launchers', signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Add a launcher', status: 201 }, signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: TeamParams, body: LauncherCreateBody }), create);
  api.get(`${base}/:launcherId`, 'One launcher', signedIn, teamRole(CAN.read), validate({ params: LauncherParams }), getOne);
  api.patch(`${base}/:launcherId`, 'Change a launcher', signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: LauncherParams, body: LauncherUpdateBody }), update);
  api.delete(`${base}/:launcherId`, { summary: 'Delete a launcher no shot uses (409 otherwise)', status: 204 }, signedIn, teamRole(EDIT_LAUNCHERS), validate({ params: LauncherParams }), remove);

  const { teamId: _teamId, ...columns } = getTableColumns(launchers);

  async function loadLauncher(teamId: string, launcherId: string) {
    const [row] = await db.select(columns).from(launchers).where(and(eq(launchers.teamId, teamId), eq(launchers.id, launcherId)));
    if (!row) throw notFound('No such launcher in this team.');
    return row;
  }

  async function list(_req: Request, res: Response) {
    res.json(await db.select(columns).from(launchers).where(eq(launchers.teamId, currentTeam(res).id)).orderBy(asc(launchers.name)));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: LauncherParams });
    res.json(await loadLauncher(currentTeam(res).id, params.launcherId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: LauncherCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const row = await db.transaction(async (tx) => {
      const [created] = await tx.insert(launchers).values({ ...body, teamId: team.id }).returning(columns);
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'launcher.create', targetType: 'launcher', targetId: created.id, detail: { name: body.name } });
      return created;
    });
    res.status(201).json(row);
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: LauncherParams, body: LauncherUpdateBody });
    const team = currentTeam(res);
    await loadLauncher(team.id, params.launcherId);
    const row = await db.transaction(async (tx) => {
      const [changed] = await tx.update(launchers).set(body).where(and(eq(launchers.teamId, team.id), eq(launchers.id, params.launcherId))).returning(columns);
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'launcher.update', targetType: 'launcher', targetId: params.launcherId, detail: { fields: Object.keys(body) } });
      return changed;
    });
    res.json(row);
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: LauncherParams });
    const team = currentTeam(res);
    const launcher = await loadLauncher(team.id, params.launcherId);
    await db.transaction(async (tx) => {
      const [{ n }] = await tx.select({ n: count() }).from(shots).where(eq(shots.launcherId, params.launcherId));
      if (n > 0) throw conflict(`${n} shot${n === 1 ? '' : 's'} name${n === 1 ? 's' : ''} the launcher “${launcher.name}”; it cannot be deleted while they do.`, { shotCount: n });
      // A design preset forecasts from this record; deleting it would orphan the preset's versions.
      const [{ p }] = await tx.select({ p: count() }).from(designPresets).where(eq(designPresets.launcherId, params.launcherId));
      if (p > 0) throw conflict(`${p} design preset${p === 1 ? '' : 's'} use${p === 1 ? 's' : ''} the launcher “${launcher.name}”; it cannot be deleted while they do.`, { presetCount: p });
      await tx.delete(launchers).where(eq(launchers.id, params.launcherId));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'launcher.delete', targetType: 'launcher', targetId: params.launcherId, detail: { name: launcher.name } });
    });
    res.status(204).end();
  }
}
