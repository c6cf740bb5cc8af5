// The auto-mark job: follows the projectile through a track's clip and writes
// marks as they are decided. Idempotent and safe to retry: each attempt claims
// the run (bumping its attempt number, so an older attempt that wakes up
// writes nothing), marks are upserts per frame, and the run's counts are read
// back from the marks table. Cancellable: the cancel endpoint sets the run
// cancelled and deleting the clip deletes the track; either is noticed within
// a second and stops the tracker, and every write re-checks ownership.
import { and, eq, inArray, sql } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { autoMarkRuns } from '../db/schema/auto-mark';
import type { Storage } from '../storage/storage';
import {
  RunNotOwned,
  TrackGone,
  endRun,
  finishRun,
  personMarkedFrames,
  reportProgress,
  requeueRun,
  staleRuns,
  stillOwned,
  writeAutoMarks,
  type RunOwner,
} from '../automark/auto-marks';
import { storageFrameSource } from '../automark/frame-source';
import { RunInputError, loadRunContext } from '../automark/run-context';
import { autoMarkTrack, type AutoMark } from '../automark/vision';

export const AUTO_MARK = 'auto-mark';

export interface AutoMarkJob {
  runId: string;
}

export interface AutoMarkDeps {
  db: Db;
  storage: Storage;
  config: Config;
  log?: (line: string) => void;
}

export interface AutoMarkAttempt {
  jobId: string;
  runId: string;
  retryCount?: number;
  retryLimit?: number;
}

const FLUSH_EVERY_MS = 150;
const FLUSH_AT_MARKS = 12;
const PROGRESS_EVERY_MS = 250;

export async function ensureAutoMarkQueue(boss: PgBoss): Promise<void> {
  if (await boss.getQueue(AUTO_MARK)) return;
  try {
    await boss.createQueue(AUTO_MARK, { name: AUTO_MARK, retryLimit: 3, retryDelay: 1, retryBackoff: true, expireInSeconds: 2 * 3600 });
  } catch (err) {
    if (!(await boss.getQueue(AUTO_MARK))) throw err;
  }
}

/** Gives the run a job and sends it. */
export async function enqueueAutoMark(boss: PgBoss, db: Db, runId: string, jobId: string): Promise<void> {
  await db.update(autoMarkRuns).set({ jobId, updatedAt: new Date() }).where(eq(autoMarkRuns.id, runId));
  const sent = await boss.send(AUTO_MARK, { runId } satisfies AutoMarkJob, { id: jobId });
  if (!sent) throw new Error('the job queue did not accept the auto-mark job');
}

export async function cancelAutoMarkJob(boss: PgBoss, jobId: string): Promise<void> {
  await boss.cancel(AUTO_MARK, jobId).catch(() => {});
}

/** Starts handling auto-mark jobs in this process; returns a stop function for the stale-run check. */
export async function startAutoMarkWorker(boss: PgBoss, deps: AutoMarkDeps): Promise<() => void> {
  await boss.work<AutoMarkJob>(AUTO_MARK, { batchSize: 1, pollingIntervalSeconds: 1, includeMetadata: true }, async ([job]) => {
    await runAutoMark(deps, { jobId: job.id, runId: job.data.runId, retryCount: job.retryCount, retryLimit: job.retryLimit });
  });
  const staleMs = deps.config.jobStaleSeconds * 1000;
  const timer = setInterval(() => void failStaleAutoMarkRuns(boss, deps.db, deps.config.jobStaleSeconds, deps.log), Math.max(1000, staleMs / 3));
  timer.unref();
  await failStaleAutoMarkRuns(boss, deps.db, deps.config.jobStaleSeconds, deps.log);
  return () => clearInterval(timer);
}

/**
 * A killed worker leaves its run 'running' with a heartbeat that stops.
 * Such runs go back to 'queued' and their job is failed back to pg-boss, which
 * retries it (same job id); the retry claims the run with a new attempt number.
 */
export async function failStaleAutoMarkRuns(boss: PgBoss, db: Db, staleSeconds: number, log?: (line: string) => void): Promise<void> {
  try {
    for (const run of await staleRuns(db, staleSeconds)) {
      if (!run.jobId) continue;
      log?.(`[jobs] auto-mark run ${run.id} went silent; handing job ${run.jobId} back for a retry`);
      await db
        .update(autoMarkRuns)
        .set({ state: 'queued', heartbeatAt: null, updatedAt: new Date() })
        .where(and(eq(autoMarkRuns.id, run.id), eq(autoMarkRuns.attempt, run.attempt), eq(autoMarkRuns.state, 'running')));
      await boss.fail(AUTO_MARK, run.jobId, { message: 'worker stopped responding' }).catch(() => {});
      const job = await boss.getJobById(AUTO_MARK, run.jobId).catch(() => null);
      if (job?.state === 'failed') await endRun(db, run.id, 'failed', 'Auto-marking stopped: the worker died on every attempt. Start it again.');
    }
  } catch (err) {
    console.error('[jobs] stale auto-mark check failed:', (err as Error).message);
  }
}

function isAbort(err: unknown): boolean {
  const name = (err as { name?: string } | null)?.name;
  return name === 'AbortError' || name === 'CancelledError';
}

export async function runAutoMark(deps: AutoMarkDeps, attempt: AutoMarkAttempt): Promise<void> {
  const { db, storage } = deps;
  const now = new Date();
  const [run] = await db
    .update(autoMarkRuns)
    .set({ state: 'running', attempt: sql`${autoMarkRuns.attempt} + 1`, heartbeatAt: now, updatedAt: now, error: null })
    .where(and(eq(autoMarkRuns.id, attempt.runId), eq(autoMarkRuns.jobId, attempt.jobId), inArray(autoMarkRuns.state, ['queued', 'running'])))
    .returning();
  if (!run) return; // cancelled, finished or superseded: nothing to do
  if (!run.startedAt) await db.update(autoMarkRuns).set({ startedAt: now }).where(eq(autoMarkRuns.id, run.id));

  const owner: RunOwner = {
    runId: run.id,
    attempt: run.attempt,
    trackId: run.trackId,
    userId: run.createdBy,
    replace: run.request.replace,
    reviewThreshold: run.reviewThreshold,
  };
  const abort = new AbortController();
  let gone: 'not-owned' | 'track-gone' | null = null;
  const watch = setInterval(() => {
    void stillOwned(db, owner)
      .then((s) => {
        if (s !== 'owned') {
          gone = s;
          abort.abort();
        }
      })
      .catch(() => {});
  }, 1000);

  let lastBeat = 0;
  const beat = (progress: number | null) => {
    const t = Date.now();
    if (t - lastBeat < PROGRESS_EVERY_MS) return;
    lastBeat = t;
    void reportProgress(db, owner, progress)
      .then((ok) => ok || abort.abort())
      .catch(() => {});
  };

  let pending: AutoMark[] = [];
  let lastFlush = Date.now();
  let writing: Promise<void> = Promise.resolve();
  const flush = (): Promise<void> => {
    const batch = pending;
    pending = [];
    lastFlush = Date.now();
    writing = writing.then(() => writeAutoMarks(db, owner, batch));
    writing.catch(() => abort.abort());
    return writing;
  };

  try {
    const ctx = await loadRunContext(db, run.trackId, run.request);
    const frames = await storageFrameSource(storage, ctx.frames, { onRead: () => beat(null) });
    const seed = run.request.seed;
    if (seed && (seed.uPx < 0 || seed.vPx < 0 || seed.uPx >= frames.width || seed.vPx >= frames.height)) {
      throw new RunInputError(`the seed (${seed.uPx}, ${seed.vPx}) is outside the ${frames.width}×${frames.height} frame`);
    }
    const kept = run.request.replace ? new Set<number>() : await personMarkedFrames(db, run.trackId);
    const outcome = await autoMarkTrack(frames, {
      ...(seed ? { seed } : {}),
      originHint: ctx.originHint,
      fromFrame: ctx.fromFrame,
      toFrame: ctx.toFrame,
      signal: abort.signal,
      onProgress: (fraction) => {
        beat(fraction);
        if (pending.length > 0 && Date.now() - lastFlush >= FLUSH_EVERY_MS) void flush().catch(() => {});
      },
      onMark: (mark) => {
        if (abort.signal.aborted) throw Object.assign(new Error('auto-marking was stopped'), { name: 'AbortError' });
        if (kept.has(mark.frameNumber)) return;
        pending.push(mark);
        if (pending.length >= FLUSH_AT_MARKS || Date.now() - lastFlush >= FLUSH_EVERY_MS) return flush();
      },
    });
    await flush();
    await finishRun(db, owner, { launchFrame: outcome.launchFrame, endReason: outcome.endReason }, { fromFrame: ctx.fromFrame, toFrame: ctx.toFrame });
    deps.log?.(`[jobs] auto-mark run ${run.id}: ${outcome.marks.length} frames decided, ended: ${outcome.endReason}`);
  } catch (err) {
    await writing.catch(() => {});
    if (err instanceof RunNotOwned || gone === 'not-owned') return;
    if (err instanceof TrackGone || gone === 'track-gone' || (isAbort(err) && (await stillOwned(db, owner)) === 'track-gone')) {
      await endRun(db, run.id, 'cancelled', 'The clip or track was deleted while auto-marking ran.', owner.attempt);
      return;
    }
    if (isAbort(err)) return; // cancelled: the cancel already wrote the state
    // The tracking core refuses input it cannot work with (too few frames, a seed off the frames) with a RangeError.
    if (err instanceof RunInputError || err instanceof RangeError) {
      await endRun(db, run.id, 'failed', `Auto-marking could not run: ${err.message}.`, owner.attempt);
      return;
    }
    const lastAttempt = (attempt.retryCount ?? 0) >= (attempt.retryLimit ?? 0);
    if (lastAttempt) {
      await endRun(db, run.id, 'failed', `Auto-marking failed: ${(err as Error).message}`, owner.attempt);
      return;
    }
    await requeueRun(db, owner, `Attempt ${(attempt.retryCount ?? 0) + 1} failed (${(err as Error).message}); retrying.`);
    throw err;
  } finally {
    clearInterval(watch);
  }
}
