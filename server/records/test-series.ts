import { and, asc, count, desc, eq, getTableName, ilike, or, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { SeriesCreateBody, SeriesListQuery } from '../../shared/schemas/records';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { escapeLike } from '../db/escape-like';
import { shots, testSeries } from '../db/schema/records';
import { conflict, notFound } from '../http/problem';

type ListQuery = z.output<typeof SeriesListQuery>;
type CreateValues = z.output<typeof SeriesCreateBody>;

// Drizzle prints columns inside a select's sql template without their table, so a plain
// `${shots.seriesId} = ${testSeries.id}` became `"series_id" = "id"` — shots' own id — and counted 0.
// Both sides are qualified by hand here.
const shotCount = sql<number>`(select count(*)::int from ${shots} where ${sql.identifier(getTableName(shots))}.${sql.identifier(shots.seriesId.name)} = ${sql.identifier(getTableName(testSeries))}.${sql.identifier(testSeries.id.name)})`;
const columns = {
  id: testSeries.id,
  name: testSeries.name,
  testDate: testSeries.testDate,
  site: testSeries.site,
  notes: testSeries.notes,
  createdAt: testSeries.createdAt,
  shotCount,
};

/**
 * Test series: one day's (or session's) shots at a site.
 * Deleting a series that still has shots is refused with 409, so shot records
 * and their clips are never lost by a single click; delete or move the shots first.
 */
export async function getSeries(db: Db, teamId: string, seriesId: string) {
  const [row] = await db.select(columns).from(testSeries).where(and(eq(testSeries.teamId, teamId), eq(testSeries.id, seriesId)));
  if (!row) throw notFound('No such test series in this team.');
  return row;
}

export async function listSeries(db: Db, teamId: string, query: ListQuery) {
  const order = query.dir === 'asc' ? asc : desc;
  const sortColumn = { date: testSeries.testDate, name: testSeries.name, created: testSeries.createdAt }[query.sort];
  const text = query.q ? `%${escapeLike(query.q)}%` : null;
  return db
    .select(columns)
    .from(testSeries)
    .where(and(eq(testSeries.teamId, teamId), text ? or(ilike(testSeries.name, text), ilike(testSeries.site, text)) : undefined))
    .orderBy(order(sortColumn), order(testSeries.createdAt));
}

export async function createSeries(db: Db, actor: Actor, body: CreateValues) {
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(testSeries).values({ ...body, teamId: actor.teamId, createdBy: actor.userId }).returning({ id: testSeries.id });
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'series.create', targetType: 'series', targetId: row.id, detail: { name: body.name } });
    return row.id;
  });
  return getSeries(db, actor.teamId, id);
}

export async function updateSeries(db: Db, actor: Actor, seriesId: string, body: Partial<CreateValues>) {
  await getSeries(db, actor.teamId, seriesId);
  await db.transaction(async (tx) => {
    await tx.update(testSeries).set(body).where(and(eq(testSeries.teamId, actor.teamId), eq(testSeries.id, seriesId)));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'series.update', targetType: 'series', targetId: seriesId, detail: { fields: Object.keys(body) } });
  });
  return getSeries(db, actor.teamId, seriesId);
}

export async function deleteSeries(db: Db, actor: Actor, seriesId: string): Promise<void> {
  const series = await getSeries(db, actor.teamId, seriesId);
  await db.transaction(async (tx) => {
    // Counted inside the transaction with the row locked, so a shot created meanwhile cannot be cascaded away.
    await tx.select({ id: testSeries.id }).from(testSeries).where(eq(testSeries.id, seriesId)).for('update');
    const [{ n }] = await tx.select({ n: count() }).from(shots).where(eq(shots.seriesId, seriesId));
    if (n > 0) {
      throw conflict(`The series “${series.name}” still has ${n} shot${n === 1 ? '' : 's'}. Delete or move them to another series first.`, { shotCount: n });
    }
    await tx.delete(testSeries).where(eq(testSeries.id, seriesId));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'series.delete', targetType: 'series', targetId: seriesId, detail: { name: series.name } });
  });
}
