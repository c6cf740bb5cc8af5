// The job queue: pg-boss on the app's own PostgreSQL, in its own schema.
// Handlers enqueue through `Jobs`; workers (in the server or `npm run worker`)
// run the handlers. Each clip's job id is written on the clip before sending,
// so a superseded job can tell it no longer owns the clip.
import { randomUUID } from 'node:crypto';
import { and, eq, isNotNull, lt, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import type { Storage } from '../storage/storage';
import { runFrameExtraction, type ExtractFramesJob } from './extract-frames';
import { cancelAutoMarkJob, enqueueAutoMark, ensureAutoMarkQueue, startAutoMarkWorker } from './auto-mark';

export const EXTRACT_FRAMES = 'extract-frames';

/** What route handlers may ask of the queue. */
export interface Jobs {
  /** Makes a new extraction job own the clip and sends it; returns the job id. */
  enqueueExtraction(clipId: string): Promise<string>;
  /** Withdraws a queued or running job (a running handler notices through the clip status). */
  cancel(jobId: string): Promise<void>;
  /** Sends the auto-mark job of a run (server/jobs/auto-mark.ts); returns the job id. */
  enqueueAutoMark(runId: string): Promise<string>;
  cancelAutoMark(jobId: string): Promise<void>;
}

export interface JobQueue {
  boss: PgBoss;
  jobs: Jobs;
  /** Starts handling jobs in this process (config.workerConcurrency extractions at a time). */
  startWorker(deps: WorkerDeps): Promise<void>;
  /**
   * Stops taking jobs, lets running extractions finish for up to `graceMs`,
   * then makes the rest hand their jobs back to the queue (retried elsewhere).
   */
  stop(graceMs?: number): Promise<void>;
}

export interface WorkerDeps {
  db: Db;
  storage: Storage;
  config: Config;
  log?: (line: string) => void;
  /** The worker's own scratch folder; default: the storage's temp folder. */
  scratchDir?: string;
}

export async function startJobQueue(config: Config, db: Db, options: { supervise?: boolean } = {}): Promise<JobQueue> {
  const boss = new PgBoss({
    connectionString: config.databaseUrl,
    schema: config.jobSchema,
    max: 4,
    supervise: options.supervise ?? true,
    schedule: false,
    migrate: true,
    application_name: 'arcbench-jobs',
  });
  boss.on('error', (err) => console.error('[jobs] queue error:', err.message));
  await boss.start();
  if (!(await boss.getQueue(EXTRACT_FRAMES))) {
    try {
      await boss.createQueue(EXTRACT_FRAMES, {
        name: EXTRACT_FRAMES,
        retryLimit: 3,
        retryDelay: 2,
        retryBackoff: true,
        // A backstop only: a dead worker is noticed much sooner through the clip's heartbeat.
        expireInSeconds: 4 * 3600,
      });
    } catch (err) {
      // Another process created it first.
      if (!(await boss.getQueue(EXTRACT_FRAMES))) throw err;
    }
  }

  await ensureAutoMarkQueue(boss);

  const jobs: Jobs = {
    async enqueueExtraction(clipId) {
      const jobId = randomUUID();
      await db
        .update(clips)
        .set({ jobId, status: 'queued', progress: 0, error: null, waitingFor: null, heartbeatAt: null, updatedAt: new Date() })
        .where(eq(clips.id, clipId));
      const sent = await boss.send(EXTRACT_FRAMES, { clipId } satisfies ExtractFramesJob, { id: jobId });
      if (!sent) throw new Error('the job queue did not accept the extraction job');
      return jobId;
    },
    async cancel(jobId) {
      await boss.cancel(EXTRACT_FRAMES, jobId).catch(() => {});
    },
    async enqueueAutoMark(runId) {
      const jobId = randomUUID();
      await enqueueAutoMark(boss, db, runId, jobId);
      return jobId;
    },
    cancelAutoMark: (jobId) => cancelAutoMarkJob(boss, jobId),
  };

  let reaper: NodeJS.Timeout | null = null;
  let stopAutoMark: (() => void) | null = null;
  let working = false;
  // Running extractions, and the signal that makes them hand their jobs back when the worker stops.
  const active = new Set<Promise<void>>();
  const stopping = new AbortController();
  return {
    boss,
    jobs,
    async startWorker(deps) {
      if (working) return;
      working = true;
      // pg-boss 10 runs one job at a time per work() call: concurrency is that many subscriptions.
      for (let i = 0; i < Math.max(1, config.workerConcurrency); i++) {
        await boss.work<ExtractFramesJob>(EXTRACT_FRAMES, { batchSize: 1, pollingIntervalSeconds: 1, includeMetadata: true }, async ([job]) => {
          const run = runFrameExtraction({ ...deps, stopping: stopping.signal }, { jobId: job.id, clipId: job.data.clipId, retryCount: job.retryCount, retryLimit: job.retryLimit });
          active.add(run);
          try {
            await run;
          } finally {
            active.delete(run);
          }
        });
      }
      const staleMs = config.jobStaleSeconds * 1000;
      reaper = setInterval(() => void failStaleExtractions(boss, db, config.jobStaleSeconds, deps.log), Math.max(1000, staleMs / 3));
      reaper.unref();
      await failStaleExtractions(boss, db, config.jobStaleSeconds, deps.log);
      stopAutoMark = await startAutoMarkWorker(boss, deps);
    },
    async stop(graceMs = 10_000) {
      if (reaper) clearInterval(reaper);
      stopAutoMark?.();
      if (working) {
        await boss.offWork(EXTRACT_FRAMES).catch(() => {});
        const handBack = setTimeout(() => stopping.abort(), graceMs);
        await Promise.allSettled([...active]);
        clearTimeout(handBack);
      }
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 }).catch(() => {});
    },
  };
}

/**
 * A worker killed mid-extraction leaves its job 'active' until pg-boss's
 * expiry. The clip's heartbeat tells us much sooner: any extraction silent for
 * longer than the stale limit is failed back to pg-boss, which retries it with
 * backoff (the retry keeps the job id, so it still owns the clip).
 */
export async function failStaleExtractions(boss: PgBoss, db: Db, staleSeconds: number, log?: (line: string) => void): Promise<void> {
  try {
    const stale = await db
      .select({ id: clips.id, jobId: clips.jobId })
      .from(clips)
      .where(and(eq(clips.status, 'extracting'), isNotNull(clips.jobId), lt(clips.heartbeatAt, sql`now() - make_interval(secs => ${staleSeconds})`)));
    for (const clip of stale) {
      log?.(`[jobs] extraction of clip ${clip.id} went silent; handing job ${clip.jobId} back for a retry`);
      await db
        .update(clips)
        .set({ status: 'queued', heartbeatAt: null, updatedAt: new Date() })
        .where(and(eq(clips.id, clip.id), eq(clips.jobId, clip.jobId!), eq(clips.status, 'extracting')));
      await boss.fail(EXTRACT_FRAMES, clip.jobId!, { message: 'worker stopped responding' }).catch(() => {});
      const job = await boss.getJobById(EXTRACT_FRAMES, clip.jobId!).catch(() => null);
      if (job?.state === 'failed') {
        await db
          .update(clips)
          .set({ status: 'failed', error: 'Extraction stopped: the worker died on every attempt. Try again with Re-extract.', updatedAt: new Date() })
          .where(and(eq(clips.id, clip.id), eq(clips.jobId, clip.jobId!), eq(clips.status, 'queued')));
      }
    }
  } catch (err) {
    console.error('[jobs] stale-job check failed:', (err as Error).message);
  }
}
