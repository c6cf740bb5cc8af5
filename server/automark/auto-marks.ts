// How the automatic marker's decisions reach the marks table. Every write
// first locks the run row and checks that this attempt still owns a running
// run, so a cancel (or a newer attempt after a worker died) stops all writes
// the moment it commits. Writes are upserts per (track, frame): a retry
// rewrites the same frames and never adds a second mark. Marks a person
// placed are kept unless the run was asked to replace them.
import { and, eq, inArray, isNull, lt, ne, or, sql, type SQL } from 'drizzle-orm';
import type { AutoMarkEndReason } from '../../shared/schemas/auto-mark';
import type { Db, Tx } from '../db/client';
import { autoMarkRuns } from '../db/schema/auto-mark';
import { marks, tracks } from '../db/schema/marking';
import { bumpTrackRevision, upsertMarkRows } from '../marking/mark-writes';
import type { AutoMark } from './vision';


/** The attempt that may write for a run. */
export interface RunOwner {
  runId: string;
  attempt: number;
  trackId: string;
  userId: string | null;
  replace: boolean;
  reviewThreshold: number;
}

/** The run was cancelled, finished, or taken over by a newer attempt: this attempt must stop and write nothing. */
export class RunNotOwned extends Error {
  constructor() {
    super('this attempt no longer owns the auto-mark run');
  }
}

/** The track (usually with its clip) was deleted while the run worked. */
export class TrackGone extends Error {
  constructor() {
    super('the track was deleted');
  }
}

const owned = (o: RunOwner) => and(eq(autoMarkRuns.id, o.runId), eq(autoMarkRuns.attempt, o.attempt), eq(autoMarkRuns.state, 'running'));

async function lockOwnedRun(tx: Tx, owner: RunOwner): Promise<void> {
  const [row] = await tx.select({ id: autoMarkRuns.id }).from(autoMarkRuns).where(owned(owner)).for('update');
  if (!row) throw new RunNotOwned();
}

/** Frames where a person's mark stands (kept unless the run replaces). */
export async function personMarkedFrames(db: Db, trackId: string): Promise<Set<number>> {
  const rows = await db
    .select({ frameNumber: marks.frameNumber })
    .from(marks)
    .where(and(eq(marks.trackId, trackId), ne(marks.source, 'auto')));
  return new Set(rows.map((r) => r.frameNumber));
}

async function countsOfRun(tx: Tx, owner: RunOwner) {
  const [row] = await tx
    .select({
      marked: sql<number>`count(*)::int`,
      flagged: sql<number>`(count(*) filter (where ${marks.confidence} < ${owner.reviewThreshold}))::int`,
    })
    .from(marks)
    .where(and(eq(marks.trackId, owner.trackId), eq(marks.autoMarkRunId, owner.runId)));
  return { framesMarked: row?.marked ?? 0, framesFlagged: row?.flagged ?? 0 };
}

/** Writes a batch of decided marks in one transaction and updates the run's counts. */
export async function writeAutoMarks(db: Db, owner: RunOwner, batch: AutoMark[]): Promise<void> {
  if (batch.length === 0) return;
  await db.transaction(async (tx) => {
    await lockOwnedRun(tx, owner);
    const revision = await bumpTrackRevision(tx, owner.trackId, () => new TrackGone());
    const now = new Date();
    const rows = batch.map((m) => ({
      trackId: owner.trackId,
      frameNumber: m.frameNumber,
      uPx: m.uPx,
      vPx: m.vPx,
      placedUPx: m.uPx,
      placedVPx: m.vPx,
      snapped: false,
      source: 'auto' as const,
      confidence: Math.min(1, Math.max(0, m.confidence)),
      lowConfidenceReason: m.reason,
      autoMarkRunId: owner.runId,
      revision,
      updatedBy: owner.userId,
      updatedAt: now,
    }));
    await upsertMarkRows(tx, rows, { overAutoOnly: !owner.replace });
    await tx.update(autoMarkRuns).set({ ...(await countsOfRun(tx, owner)), heartbeatAt: now, updatedAt: now }).where(eq(autoMarkRuns.id, owner.runId));
  });
}

/** Progress and a sign of life; false when the attempt no longer owns the run. */
export async function reportProgress(db: Db, owner: RunOwner, progress: number | null): Promise<boolean> {
  const now = new Date();
  const rows = await db
    .update(autoMarkRuns)
    .set({ ...(progress === null ? {} : { progress: Math.min(0.99, Math.max(0, progress)) }), heartbeatAt: now, updatedAt: now })
    .where(owned(owner))
    .returning({ id: autoMarkRuns.id });
  return rows.length > 0;
}

/** Still ours, and the track still there? (a cancel or a clip deletion ends the work) */
export async function stillOwned(db: Db, owner: RunOwner): Promise<'owned' | 'not-owned' | 'track-gone'> {
  const [run] = await db.select({ id: autoMarkRuns.id }).from(autoMarkRuns).where(owned(owner));
  if (!run) return 'not-owned';
  const [track] = await db.select({ id: tracks.id }).from(tracks).where(eq(tracks.id, owner.trackId));
  return track ? 'owned' : 'track-gone';
}

/**
 * Ends a run that completed: automatic marks in the range from earlier runs
 * that this run did not decide again are removed (they would contradict it),
 * then the counts are taken from the table itself, so a retried run reports
 * exactly what is stored.
 */
export async function finishRun(
  db: Db,
  owner: RunOwner,
  outcome: { launchFrame: number | null; endReason: AutoMarkEndReason },
  range: { fromFrame: number; toFrame: number },
): Promise<void> {
  await db.transaction(async (tx) => {
    await lockOwnedRun(tx, owner);
    const staleAuto: SQL = and(
      eq(marks.trackId, owner.trackId),
      eq(marks.source, 'auto'),
      sql`${marks.frameNumber} between ${range.fromFrame} and ${range.toFrame}`,
      or(isNull(marks.autoMarkRunId), ne(marks.autoMarkRunId, owner.runId)),
    )!;
    const [stale] = await tx.select({ n: sql<number>`count(*)::int` }).from(marks).where(staleAuto);
    if ((stale?.n ?? 0) > 0) {
      await bumpTrackRevision(tx, owner.trackId, () => new TrackGone());
      await tx.delete(marks).where(staleAuto);
    }
    const now = new Date();
    await tx
      .update(autoMarkRuns)
      .set({
        ...(await countsOfRun(tx, owner)),
        state: 'done',
        progress: 1,
        launchFrame: outcome.launchFrame,
        endReason: outcome.endReason,
        error: null,
        heartbeatAt: null,
        finishedAt: now,
        updatedAt: now,
      })
      .where(eq(autoMarkRuns.id, owner.runId));
  });
}

/** Ends a run that is still queued or running with the given state (cancelled or failed). */
export async function endRun(db: Db, runId: string, state: 'cancelled' | 'failed', error: string | null, attempt?: number): Promise<boolean> {
  const now = new Date();
  const rows = await db
    .update(autoMarkRuns)
    .set({ state, error, heartbeatAt: null, finishedAt: now, updatedAt: now })
    .where(and(eq(autoMarkRuns.id, runId), inArray(autoMarkRuns.state, ['queued', 'running']), attempt === undefined ? undefined : eq(autoMarkRuns.attempt, attempt)))
    .returning({ id: autoMarkRuns.id });
  return rows.length > 0;
}

/** Hands a failed attempt back for a retry. */
export async function requeueRun(db: Db, owner: RunOwner, error: string): Promise<void> {
  await db.update(autoMarkRuns).set({ state: 'queued', error, heartbeatAt: null, updatedAt: new Date() }).where(owned(owner));
}

/** Runs whose worker went silent (killed): back to queued so the retry may claim them. */
export async function staleRuns(db: Db, staleSeconds: number) {
  return db
    .select({ id: autoMarkRuns.id, jobId: autoMarkRuns.jobId, attempt: autoMarkRuns.attempt })
    .from(autoMarkRuns)
    .where(and(eq(autoMarkRuns.state, 'running'), lt(autoMarkRuns.heartbeatAt, sql`now() - make_interval(secs => ${staleSeconds})`)));
}
