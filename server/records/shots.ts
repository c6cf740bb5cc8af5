import { and, count, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { z } from 'zod';
import type { Shot, ShotCreateBody, ShotListQuery, ShotSort } from '../../shared/schemas/records';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { escapeLike } from '../db/escape-like';
import { launchers, projectiles, shots, testSeries } from '../db/schema/records';
import { latestClipColumn, shotClipCount } from '../db/shot-clips';
import { badRequest, conflict, notFound } from '../http/problem';

// Shots: one firing each, with the conditions it was fired in, stored exactly
// as given (SI). Air density is derived from them later, unless one was stated directly.

type ListQuery = z.output<typeof ShotListQuery>;
type ShotValues = z.output<typeof ShotCreateBody>;

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
  windSpeedMps: shots.windSpeedMps,
  windFromDeg: shots.windFromDeg,
  launchHeightM: shots.launchHeightM,
  airDensityKgM3: shots.airDensityKgM3,
  airDensityTolKgM3: shots.airDensityTolKgM3,
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

function joined(db: Db) {
  return db
    .select(columns)
    .from(shots)
    .innerJoin(testSeries, eq(testSeries.id, shots.seriesId))
    .leftJoin(launchers, eq(launchers.id, shots.launcherId))
    .leftJoin(projectiles, eq(projectiles.id, shots.projectileId));
}

type JoinedRow = Awaited<ReturnType<ReturnType<typeof joined>['execute']>>[number];

/** The API's shot: wind and a stated air density as objects (null when not stated), the rest as stored. */
function toShot(row: JoinedRow): Shot {
  const { windSpeedMps, windFromDeg, airDensityKgM3, airDensityTolKgM3, createdAt, updatedAt, ...rest } = row;
  return {
    ...rest,
    wind: windSpeedMps === null || windFromDeg === null ? null : { speedMps: windSpeedMps, fromDeg: windFromDeg },
    airDensity: airDensityKgM3 === null ? null : { densityKgM3: airDensityKgM3, tolKgM3: airDensityTolKgM3 },
    createdAt: createdAt.toISOString(),
    updatedAt: updatedAt.toISOString(),
  };
}

/** Column values of the shot's stated conditions; objects left out of a change stay as they are. */
function conditionColumns(body: Partial<Pick<ShotValues, 'wind' | 'airDensity'>>) {
  const out: Partial<typeof shots.$inferInsert> = {};
  if (body.wind !== undefined) {
    out.windSpeedMps = body.wind?.speedMps ?? null;
    out.windFromDeg = body.wind?.fromDeg ?? null;
  }
  if (body.airDensity !== undefined) {
    out.airDensityKgM3 = body.airDensity?.densityKgM3 ?? null;
    out.airDensityTolKgM3 = body.airDensity?.tolKgM3 ?? null;
  }
  return out;
}

export async function getShot(db: Db, teamId: string, shotId: string): Promise<Shot> {
  const [row] = await joined(db).where(and(eq(shots.teamId, teamId), eq(shots.id, shotId)));
  if (!row) throw notFound('No such shot in this team.');
  return toShot(row);
}

/** One page of the team's shots, sorted and filtered on the server. */
export async function listShots(db: Db, teamId: string, query: ListQuery) {
  const text = query.q ? `%${escapeLike(query.q)}%` : null;
  const where = and(
    eq(shots.teamId, teamId),
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
    joined(db)
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
  return { items: items.map(toShot), total, page: query.page, pageSize: query.pageSize };
}

export async function createShot(db: Db, actor: Actor, body: ShotValues) {
  await checkReferences(db, actor.teamId, body);
  const id = await db.transaction(async (tx) => {
    const { wind, airDensity, ...plain } = body;
    const [row] = await tx
      .insert(shots)
      .values({ ...plain, ...conditionColumns({ wind, airDensity }), teamId: actor.teamId, createdBy: actor.userId })
      .returning({ id: shots.id });
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'shot.create', targetType: 'shot', targetId: row.id, detail: { label: body.label, seriesId: body.seriesId } });
    return row.id;
  });
  return getShot(db, actor.teamId, id);
}

export async function updateShot(db: Db, actor: Actor, shotId: string, body: Partial<ShotValues>) {
  await getShot(db, actor.teamId, shotId);
  await checkReferences(db, actor.teamId, body);
  const { wind, airDensity, ...plain } = body;
  await db.transaction(async (tx) => {
    await tx
      .update(shots)
      .set({ ...plain, ...conditionColumns({ wind, airDensity }), updatedAt: new Date() })
      .where(and(eq(shots.teamId, actor.teamId), eq(shots.id, shotId)));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'shot.update', targetType: 'shot', targetId: shotId, detail: { fields: Object.keys(body) } });
  });
  return getShot(db, actor.teamId, shotId);
}

/** Deletes a shot that has no clips (409 otherwise). */
export async function deleteShot(db: Db, actor: Actor, shotId: string): Promise<void> {
  const shot = await getShot(db, actor.teamId, shotId);
  await db.transaction(async (tx) => {
    await tx.select({ id: shots.id }).from(shots).where(eq(shots.id, shotId)).for('update');
    const clips = await shotClipCount(tx, shotId);
    if (clips > 0) {
      // Clips own files on disk; deleting them goes through the clip API, which removes the files too.
      throw conflict(`The shot “${shot.label}” still has ${clips} clip${clips === 1 ? '' : 's'}. Delete its clips first.`, { clipCount: clips });
    }
    await tx.delete(shots).where(eq(shots.id, shotId));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'shot.delete', targetType: 'shot', targetId: shotId, detail: { label: shot.label, seriesId: shot.seriesId } });
  });
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
