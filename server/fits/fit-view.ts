// Reading fits for the API: one fit in full (result, snapshot, staleness,
// review, audit trail) or a list of summaries.
import { aliasedTable, and, asc, count, desc, eq, lt, lte, ne, sql } from 'drizzle-orm';
import type { FitAuditEntry, FitDetail, FitState, FitSummary, Staleness } from '../../shared/schemas/fits';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema/audit-events';
import { fits } from '../db/schema/fits';
import { launchers, projectiles, shots, testSeries } from '../db/schema/records';
import { users } from '../db/schema/users';
import { notFound } from '../http/problem';
import { refreshStaleness } from './staleness';

const creator = aliasedTable(users, 'fit_creator');
const reviewer = aliasedTable(users, 'fit_reviewer');

function summaryColumns() {
  return {
    id: fits.id,
    teamId: fits.teamId,
    shotId: fits.shotId,
    clipId: fits.clipId,
    trackId: fits.trackId,
    calibrationId: fits.calibrationId,
    calibrationVersion: fits.calibrationVersion,
    marksRevision: fits.marksRevision,
    state: fits.state,
    launchSpeedMps: fits.launchSpeedMps,
    launchAngleDeg: fits.launchAngleDeg,
    dragCoefficient: fits.dragCoefficient,
    dragK_perM: fits.dragK_perM,
    rmsResidualM: fits.rmsResidualM,
    dragVerdict: fits.dragVerdict,
    createdById: creator.id,
    createdByName: creator.displayName,
    createdAt: fits.createdAt,
    reviewedById: reviewer.id,
    reviewedByName: reviewer.displayName,
    reviewedAt: fits.reviewedAt,
    reviewNote: fits.reviewNote,
    inputHash: fits.inputHash,
  };
}

type SummaryRow = { [K in keyof ReturnType<typeof summaryColumns>]: unknown } & {
  id: string;
  trackId: string;
  clipId: string;
  marksRevision: number;
  calibrationVersion: number;
  state: FitState;
};

function person(id: unknown, name: unknown) {
  return id ? { id: String(id), displayName: String(name) } : null;
}

function toSummary(r: SummaryRow, s: Staleness): FitSummary {
  return {
    id: r.id,
    shotId: String(r.shotId),
    trackId: r.trackId,
    state: r.state,
    launchSpeedMps: Number(r.launchSpeedMps),
    launchAngleDeg: Number(r.launchAngleDeg),
    dragCoefficient: r.dragCoefficient === null ? null : Number(r.dragCoefficient),
    dragK_perM: r.dragK_perM === null ? null : Number(r.dragK_perM),
    rmsResidualM: Number(r.rmsResidualM),
    dragVerdict: String(r.dragVerdict),
    inputsChanged: s.inputsChanged,
    createdBy: person(r.createdById, r.createdByName),
    createdAt: (r.createdAt as Date).toISOString(),
    reviewedBy: person(r.reviewedById, r.reviewedByName),
    reviewedAt: r.reviewedAt ? (r.reviewedAt as Date).toISOString() : null,
  };
}

function baseQuery(db: Db) {
  return db
    .select(summaryColumns())
    .from(fits)
    .leftJoin(creator, eq(creator.id, fits.createdBy))
    .leftJoin(reviewer, eq(reviewer.id, fits.reviewedBy));
}

export async function listShotFits(db: Db, teamId: string, shotId: string): Promise<FitSummary[]> {
  const rows = (await baseQuery(db).where(and(eq(fits.teamId, teamId), eq(fits.shotId, shotId))).orderBy(desc(fits.createdAt))) as SummaryRow[];
  const staleness = await refreshStaleness(db, rows);
  return rows.map((r) => toSummary(r, staleness.get(r.id)!));
}

export async function fitAuditTrail(db: Db, fitId: string): Promise<FitAuditEntry[]> {
  const rows = await db
    .select({ action: auditEvents.action, actorId: users.id, actorName: users.displayName, at: auditEvents.createdAt, detail: auditEvents.detail })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(and(eq(auditEvents.targetType, 'fit'), eq(auditEvents.targetId, fitId)))
    .orderBy(asc(auditEvents.createdAt));
  return rows.map((r) => ({ action: r.action, actor: person(r.actorId, r.actorName), at: r.at.toISOString(), detail: r.detail }));
}

export async function loadFitDetail(db: Db, teamId: string, fitId: string): Promise<FitDetail> {
  const [row] = (await db
    .select({
      ...summaryColumns(),
      result: fits.result,
      snapshot: fits.inputSnapshot,
      shotLabel: shots.label,
      seriesName: testSeries.name,
      launcherName: launchers.name,
      projectileName: projectiles.name,
    })
    .from(fits)
    .leftJoin(creator, eq(creator.id, fits.createdBy))
    .leftJoin(reviewer, eq(reviewer.id, fits.reviewedBy))
    .innerJoin(shots, eq(shots.id, fits.shotId))
    .leftJoin(testSeries, eq(testSeries.id, shots.seriesId))
    .leftJoin(launchers, eq(launchers.id, shots.launcherId))
    .leftJoin(projectiles, eq(projectiles.id, shots.projectileId))
    .where(and(eq(fits.teamId, teamId), eq(fits.id, fitId)))) as (SummaryRow & {
    result: FitDetail['result'];
    snapshot: FitDetail['snapshot'];
    shotLabel: string;
    seriesName: string | null;
    launcherName: string | null;
    projectileName: string | null;
  })[];
  if (!row) throw notFound('No such fit in this team.');
  const staleness = (await refreshStaleness(db, [row])).get(row.id)!;
  return {
    ...toSummary(row, staleness),
    teamId,
    clipId: row.clipId,
    calibrationId: String(row.calibrationId),
    calibrationVersion: row.calibrationVersion,
    marksRevision: row.marksRevision,
    inputHash: String(row.inputHash),
    reviewNote: (row.reviewNote as string | null) ?? null,
    staleness,
    shot: { id: String(row.shotId), label: row.shotLabel, seriesName: row.seriesName, launcherName: row.launcherName, projectileName: row.projectileName },
    result: row.result,
    snapshot: row.snapshot,
    audit: await fitAuditTrail(db, fitId),
    sameInputsAs: await earlierFitWithSameInputs(db, teamId, String(row.shotId), fitId, String(row.inputHash)),
  };
}

/**
 * The first earlier fit of the same shot whose inputs hash the same (server/fits/input-hash.ts): a run on
 * identical inputs gives identical numbers, so the page says which fit it repeats instead of running silently.
 * `number` counts the shot's fits in the order they ran, as the shot's fit list does.
 */
export async function earlierFitWithSameInputs(db: Db, teamId: string, shotId: string, fitId: string, hash: string): Promise<FitDetail['sameInputsAs']> {
  // Times are compared in SQL: timestamptz keeps microseconds that a JavaScript Date would round away.
  const createdAtOf = (id: string) => sql`(select f0.created_at from ${fits} f0 where f0.id = ${id})`;
  const [earlier] = await db
    .select({ id: fits.id, createdAt: fits.createdAt, state: fits.state })
    .from(fits)
    .where(and(eq(fits.teamId, teamId), eq(fits.shotId, shotId), eq(fits.inputHash, hash), ne(fits.id, fitId), lt(fits.createdAt, createdAtOf(fitId))))
    .orderBy(asc(fits.createdAt))
    .limit(1);
  if (!earlier) return null;
  const [{ n }] = await db
    .select({ n: count() })
    .from(fits)
    .where(and(eq(fits.teamId, teamId), eq(fits.shotId, shotId), lte(fits.createdAt, createdAtOf(earlier.id))));
  return { id: earlier.id, number: Number(n), state: earlier.state as FitState, createdAt: earlier.createdAt.toISOString() };
}
