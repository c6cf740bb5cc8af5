import type { Request, Response } from 'express';
import { and, count, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { ShotCreateBody, ShotListQuery, ShotParams, ShotUpdateBody, type ShotSort } from '../../shared/schemas/records';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import type { Db } from '../db/client';
import { escapeLike } from '../db/escape-like';
import { launchers, projectiles, shots, testSeries } from '../db/schema/records';
import { currentTeam, currentUser, input } from '../http/input';
import { badRequest, conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { latestClipColumn, shotClipCount } from '../db/shot-clips';

/**
 * Shots: one firing each, with the conditions it was fired in, stored exactly
 * as given (SI; air density is derived from them later, never stored here).
 */
export function shotRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/shots';
  api.get(base, 'List the team’s shots: paged, sorted and filtered on the server', signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: ShotListQuery }), list);
  api.post(base, { summary: 'Record a shot', status: 201 }, signedIn, teamRole(CAN.editShots), validate({ params: TeamParams, body: ShotCreateBody }), create);
  api.get(`${base}/:shotId`, 'One shot with its conditions', signedIn, teamRole(CAN.read), validate({ params: ShotParams }), getOne);
  api.patch(`${base}/:shotId`, 'Change a shot', signedIn, teamRole(CAN.editShots), validate({ params: ShotParams, body: ShotUpdateBody }), update);
  api.delete(`${base}/:shotId`, { summary: 'Delete a shot that has no clips (409 otherwise)', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: ShotParams }), remove);

  const columns = {
    id: shots.id,
    seriesId: shots.seriesId,
    seriesName: testSeries.name,
    launcherId: shots.launcherId,
    launcherName: launchers.name,
    projectileId: shots.projectileId,
    projectileName: projectiles.name,
    label: shots.label,
    chamberPressurePa: shots.chamberPressurePa,
    elevationDeg: shots.elevationDeg,
    airTempC: shots.airTempC,
    stationPressurePa: shots.stationPressurePa,
    relativeHumidityPct: shots.relativeHumidityPct,
    tapeRangeM: shots.tapeRangeM,
    notes: shots.notes,
    createdAt: shots.createdAt,
    updatedAt: shots.updatedAt,
    latestClip: latestClipColumn(),
  };

  const SORT_COLUMNS: Record<ShotSort, AnyPgColumn> = {
    label: shots.label,
    created: shots.createdAt,
    series: testSeries.name,
    launcher: launchers.name,
    elevation: shots.elevationDeg,
    pressure: shots.chamberPressurePa,
  };

  function joined() {
    return db
      .select(columns)
      .from(shots)
      .innerJoin(testSeries, eq(testSeries.id, shots.seriesId))
      .leftJoin(launchers, eq(launchers.id, shots.launcherId))
      .leftJoin(projectiles, eq(projectiles.id, shots.projectileId));
  }

  async function loadShot(teamId: string, shotId: string) {
    const [row] = await joined().where(and(eq(shots.teamId, teamId), eq(shots.id, shotId)));
    if (!row) throw notFound('No such shot in this team.');
    return row;
  }

  async function list(_req: Request, res: Response) {
    const { query } = input(res, { query: ShotListQuery });
    const team = currentTeam(res);
    const text = query.q ? `%${escapeLike(query.q)}%` : null;
    const where = and(
      eq(shots.teamId, team.id),
      query.seriesId ? eq(shots.seriesId, query.seriesId) : undefined,
      query.launcherId ? eq(shots.launcherId, query.launcherId) : undefined,
      query.projectileId ? eq(shots.projectileId, query.projectileId) : undefined,
      text
        ? or(ilike(shots.label, text), ilike(shots.notes, text), ilike(testSeries.name, text), ilike(launchers.name, text), ilike(projectiles.name, text))
        : undefined,
    );
    const sortColumn = SORT_COLUMNS[query.sort];
    // Empty values sort last in both directions; id breaks ties so pages never overlap.
    const order: SQL[] = [
      query.dir === 'asc' ? sql`${sortColumn} asc nulls last` : sql`${sortColumn} desc nulls last`,
      sql`${shots.createdAt} desc`,
      sql`${shots.id} asc`,
    ];
    const [items, [{ total }]] = await Promise.all([
      joined()
        .where(where)
        .orderBy(...order)
        .limit(query.pageSize)
        .offset((query.page - 1) * query.pageSize),
      db
        .select({ total: count() })
        .from(shots)
        .innerJoin(testSeries, eq(testSeries.id, shots.seriesId))
        .leftJoin(launchers, eq(launchers.id, shots.launcherId))
        .leftJoin(projectiles, eq(projectiles.id, shots.projectileId))
        .where(where),
    ]);
    res.json({ items, total, page: query.page, pageSize: query.pageSize });
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotParams });
    res.json(await loadShot(currentTeam(res).id, params.shotId));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: ShotCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    await checkReferences(db, team.id, body);
    const id = await db.transaction(async (tx) => {
      const [row] = await tx.insert(shots).values({ ...body, teamId: team.id, createdBy: user.id }).returning({ id: shots.id });
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: 'shot.create', targetType: 'shot', targetId: row.id, detail: { label: body.label, seriesId: body.seriesId } });
      return row.id;
    });
    res.status(201).json(await loadShot(team.id, id));
  }

  async function update(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ShotParams, body: ShotUpdateBody });
    const team = currentTeam(res);
    await loadShot(team.id, params.shotId);
    await checkReferences(db, team.id, body);
    await db.transaction(async (tx) => {
      await tx
        .update(shots)
        .set({ ...body, updatedAt: new Date() })
        .where(and(eq(shots.teamId, team.id), eq(shots.id, params.shotId)));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'shot.update', targetType: 'shot', targetId: params.shotId, detail: { fields: Object.keys(body) } });
    });
    res.json(await loadShot(team.id, params.shotId));
  }

  async function remove(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotParams });
    const team = currentTeam(res);
    const shot = await loadShot(team.id, params.shotId);
    await db.transaction(async (tx) => {
      await tx.select({ id: shots.id }).from(shots).where(eq(shots.id, params.shotId)).for('update');
      const clips = await shotClipCount(tx, params.shotId);
      if (clips > 0) {
        // Clips own files on disk; deleting them goes through the clip API, which removes the files too.
        throw conflict(`The shot “${shot.label}” still has ${clips} clip${clips === 1 ? '' : 's'}. Delete its clips first.`, { clipCount: clips });
      }
      await tx.delete(shots).where(eq(shots.id, params.shotId));
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'shot.delete', targetType: 'shot', targetId: params.shotId, detail: { label: shot.label, seriesId: shot.seriesId } });
    });
    res.status(204).end();
  }
}

/** Series, launcher and projectile must be the team's own; a foreign or unknown id is a field error, not a 500 from the foreign key. */
async function checkReferences(db: Db, teamId: string, body: { seriesId?: string; launcherId?: string | null; projectileId?: string | null }) {
  const errors: { path: string; message: string }[] = [];
  const owned = async (table: typeof testSeries | typeof launchers | typeof projectiles, id: string) =>
    (await db.select({ id: table.id }).from(table).where(and(eq(table.teamId, teamId), eq(table.id, id)))).length > 0;
  if (body.seriesId && !(await owned(testSeries, body.seriesId))) errors.push({ path: 'body.seriesId', message: 'is not a test series of this team' });
  if (body.launcherId && !(await owned(launchers, body.launcherId))) errors.push({ path: 'body.launcherId', message: 'is not a launcher of this team' });
  if (body.projectileId && !(await owned(projectiles, body.projectileId))) errors.push({ path: 'body.projectileId', message: 'is not a projectile of this team' });
  if (errors.length > 0) throw badRequest(errors.map((e) => `${e.path} ${e.message}`).join('; '), { errors });
}
