import type { Request, Response } from 'express';
import { and, asc, count, eq, getTableColumns } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { ProjectileCreateBody, ProjectileParams, ProjectileUpdateBody } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { projectiles, shots } from '../db/schema/records';
import { designPresets } from '../db/schema/presets';
import { currentTeam, currentUser, input } from '../http/input';
import { conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

// Engineers maintain projectiles as well as analysts: presets and keep-out distances depend on them.
const EDIT_PROJECTILES = CAN.editEquipment;

/** Projectiles the team fires. A projectile still named by shots cannot be deleted (409), so no shot silently loses it. */
export function projectileRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/projectiles';
  api.get(base, 'List the team’s projectiles', signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Add a projectile', status: 201 }, signedIn, teamRole(EDIT_PROJECTILES), validate({ params: TeamParams, body: ProjectileCreateBody }), create);
  api.get(`${base}/:projectileId`, 'One projectile', signedIn, teamRole(CAN.read), validate({ params: ProjectileParams }), getOne);
  api.patch(`${base}/:projectileId`, 'Change a projectile', signedIn, teamRole(EDIT_PROJECTILES), validate({ params: ProjectileParams, body: ProjectileUpdateBody }), update);
  api.delete(`${base}/:projectileId`, { summary: 'Delete a projectile no shot uses (409 otherwise)', status: 204 }, signedIn, teamRole(EDIT_PROJECTILES), validate({ params: ProjectileParams }), remove);

  const { teamId: _teamId, ...columns } = getTableColumns(projectiles);

  async function loadProjectile(teamId: string, projectileId: string) {
    const [row] = await db.select(columns).from(projectiles).where(and(eq(projectiles.teamId, teamId), eq(projectiles.id, projectileId)));
    if (!row) throw notFound('No such projectile in this team.');
    return row;
  }

  async function list(_req: Request, res: Response) {
    res.json(await db.select(columns).from(projectiles).where(eq(projectiles.teamId, currentTeam(res).id)).orderBy(asc(projectiles.name)));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: ProjectileParams });
    res.json(await loadProjectile(currentTeam(res).id, params.projectileId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: ProjectileCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const row = await db.transaction(async (tx) => {
      const [created] = await tx.insert(projectiles).values({ ...body, teamId: team.id }).returning(columns);
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'projectile.create', targetType: 'projectile', targetId: created.id, detail: { name: body.name } });
      return created;
    });
    res.status(201).json(row);
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ProjectileParams, body: ProjectileUpdateBody });
    const team = currentTeam(res);
    await loadProjectile(team.id, params.projectileId);
    const row = await db.transaction(async (tx) => {
      const [changed] = await tx.update(projectiles).set(body).where(and(eq(projectiles.teamId, team.id), eq(projectiles.id, params.projectileId))).returning(columns);
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'projectile.update', targetType: 'projectile', targetId: params.projectileId, detail: { fields: Object.keys(body) } });
      return changed;
    });
    res.json(row);
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: ProjectileParams });
    const team = currentTeam(res);
    const projectile = await loadProjectile(team.id, params.projectileId);
    await db.transaction(async (tx) => {
      const [{ n }] = await tx.select({ n: count() }).from(shots).where(eq(shots.projectileId, params.projectileId));
      if (n > 0) throw conflict(`${n} shot${n === 1 ? '' : 's'} name${n === 1 ? 's' : ''} the projectile “${projectile.name}”; it cannot be deleted while they do.`, { shotCount: n });
      // A design preset forecasts from this record; deleting it would orphan the preset's versions.
      const [{ p }] = await tx.select({ p: count() }).from(designPresets).where(eq(designPresets.projectileId, params.projectileId));
      if (p > 0) throw conflict(`${p} design preset${p === 1 ? '' : 's'} use${p === 1 ? 's' : ''} the projectile “${projectile.name}”; it cannot be deleted while they do.`, { presetCount: p });
      await tx.delete(projectiles).where(eq(projectiles.id, params.projectileId));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'projectile.delete', targetType: 'projectile', targetId: params.projectileId, detail: { name: projectile.name } });
    });
    res.status(204).end();
  }
}
