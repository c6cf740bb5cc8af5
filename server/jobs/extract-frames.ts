// The frame-extraction job. Idempotent and safe to retry: each run extracts
// into a fresh temp folder, moves the frames to a new versioned storage prefix,
// and swaps the clip's frame rows to it in one transaction; older versions are
// deleted afterwards. A run that no longer owns the clip (cancelled, deleted,
// or superseded by a newer job) stops and leaves the current frames alone.
import { randomBytes, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { and, eq, inArray } from 'drizzle-orm';
import { frameTimeS } from '../../shared/marking/frame-time';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { clipFrames, clips } from '../db/schema/clips';
import { CancelledError, MediaError, extractFrames, frameTimestamps, probe } from '../media/ffmpeg';
import { analyseTimeBase } from '../media/time-base';
import { clipPrefix, isStorageUnavailable, type Storage } from '../storage/storage';

export interface ExtractFramesJob {
  clipId: string;
}

export interface ExtractionDeps {
  db: Db;
  storage: Storage;
  config: Config;
  log?: (line: string) => void;
  /** The worker's own scratch folder (default: the storage's temp folder). */
  scratchDir?: string;
  /** Aborted when the worker is stopping: the run hands its job back to the queue. */
  stopping?: AbortSignal;
}

export interface ExtractionRun {
  jobId: string;
  clipId: string;
  /** pg-boss attempt bookkeeping; a run on its last attempt marks the clip failed instead of queued. */
  retryCount?: number;
  retryLimit?: number;
}

export const THUMBNAIL_COUNT = 12;
export const THUMBNAIL_WIDTH_PX = 160;
const PROGRESS_EVERY_MS = 250;

class NotOwner extends Error {}
class HandedBack extends Error {}

/** Source frame numbers for the thumbnail strip: evenly spread over the range, ends included. */
export function thumbnailFrames(inFrame: number, outFrame: number, count = THUMBNAIL_COUNT): number[] {
  const span = outFrame - inFrame;
  if (span + 1 <= count) return Array.from({ length: span + 1 }, (_, i) => inFrame + i);
  return [...new Set(Array.from({ length: count }, (_, i) => inFrame + Math.round((span * i) / (count - 1))))];
}

export async function runFrameExtraction(deps: ExtractionDeps, run: ExtractionRun): Promise<void> {
  const { db, storage, config } = deps;
  const owned = and(eq(clips.id, run.clipId), eq(clips.jobId, run.jobId));
  const [clip] = await db
    .update(clips)
    .set({ status: 'extracting', progress: 0, error: null, waitingFor: null, heartbeatAt: new Date(), updatedAt: new Date() })
    .where(and(owned, inArray(clips.status, ['queued', 'extracting'])))
    .returning();
  if (!clip) return; // deleted, cancelled or superseded: nothing to do

  const abort = new AbortController();
  const onStop = () => abort.abort();
  deps.stopping?.addEventListener('abort', onStop, { once: true });
  const stillOwner = async () => {
    const [row] = await db.select({ status: clips.status }).from(clips).where(owned);
    if (!row || row.status !== 'extracting') abort.abort();
    return !abort.signal.aborted;
  };
  const beatMs = Math.max(500, Math.min(2000, (config.jobStaleSeconds * 1000) / 3));
  const heartbeat = setInterval(() => {
    void db
      .update(clips)
      .set({ heartbeatAt: new Date() })
      .where(and(owned, eq(clips.status, 'extracting')))
      .returning({ id: clips.id })
      .then((rows) => rows.length === 0 && abort.abort())
      .catch(() => {});
  }, beatMs);

  const workRoot = path.join(deps.scratchDir ?? storage.tempDir, 'extract');
  const workDir = path.join(workRoot, `${clip.id}-${randomBytes(4).toString('hex')}`);
  const framesDir = path.join(workDir, 'frames');
  const thumbsDir = path.join(workDir, 'thumbs');
  const total = clip.outFrame - clip.inFrame + 1;
  let newPrefix: string | null = null;
  try {
    // Leftovers of an earlier, killed attempt on this clip.
    await mkdir(workRoot, { recursive: true });
    for (const name of await readdir(workRoot)) {
      if (name.startsWith(`${clip.id}-`)) await rm(path.join(workRoot, name), { recursive: true, force: true });
    }
    await mkdir(framesDir, { recursive: true });
    await mkdir(thumbsDir, { recursive: true });

    // A file ffmpeg can seek in: the stored file on local disk, a download into scratch from an object store.
    const input = (await storage.localCopy(clip.storageKey, workDir)).path;
    // Timestamps were read at upload; older rows get them from ffprobe while ffmpeg extracts.
    const timing = (
      clip.framePtsS && clip.baseFps > 0
        ? Promise.resolve({ pts: clip.framePtsS, containerFps: clip.containerFps, baseFps: clip.baseFps })
        : Promise.all([probe(input), frameTimestamps(input, abort.signal)]).then(([facts, pts]) => ({ pts, containerFps: facts.containerFps, baseFps: facts.baseFps }))
    ).then((t) => analyseTimeBase({ ptsS: t.pts, containerFps: t.containerFps, baseFps: t.baseFps, captureFps: clip.captureFps }));
    let timingError: unknown = null;
    timing.catch((err) => {
      timingError = err;
      abort.abort();
    });

    let lastWrite = 0;
    const extraction = extractFrames({
      input,
      outDir: framesDir,
      inFrame: clip.inFrame,
      outFrame: clip.outFrame,
      jpegQuality: config.jpegQuality,
      thumbnails: { outDir: thumbsDir, frameNumbers: thumbnailFrames(clip.inFrame, clip.outFrame), widthPx: THUMBNAIL_WIDTH_PX, jpegQuality: Math.min(config.jpegQuality, 80) },
      signal: abort.signal,
      onProgress: (done) => {
        const now = Date.now();
        if (now - lastWrite < PROGRESS_EVERY_MS) return;
        lastWrite = now;
        void db
          .update(clips)
          .set({ progress: Math.min(0.95, (0.95 * done) / total), heartbeatAt: new Date() })
          .where(and(owned, eq(clips.status, 'extracting')))
          .returning({ id: clips.id })
          .then((rows) => rows.length === 0 && abort.abort())
          .catch(() => {});
      },
    });
    await extraction.catch((err) => {
      throw timingError ?? err;
    });
    const timeBase = await timing;
    if (!(await stillOwner())) throw new CancelledError();
    const written = (await readdir(framesDir)).filter((n) => /^\d{6,}\.jpg$/.test(n)).sort();
    if (written.length === 0) throw new MediaError('ffmpeg decoded no frames in the chosen range');

    const version = `v-${Date.now().toString(36)}-${randomBytes(3).toString('hex')}`;
    newPrefix = `${clipPrefix(clip.teamId, clip.id)}${version}/`;
    // Only frame files go into storage.
    for (const name of await readdir(framesDir)) if (!written.includes(name)) await rm(path.join(framesDir, name), { force: true });
    const storedFrames = await storage.putDirectory(`${newPrefix}frames/`, framesDir);
    const rows: (typeof clipFrames.$inferInsert)[] = storedFrames.map((stored) => {
      const frameNumber = Number(stored.key.slice(stored.key.lastIndexOf('/') + 1, -4));
      const time = timeBase.frames[frameNumber];
      return {
        clipId: clip.id,
        frameNumber,
        // Upload validates a positive capture rate, so the rule always gives a time here.
        tS: frameTimeS(frameNumber, time?.tS, clip.captureFps) as number,
        ptsS: time?.ptsS ?? null,
        flag: time?.flag ?? null,
        storageKey: stored.key,
        sizeBytes: stored.sizeBytes,
      };
    });
    const thumbFiles = (await storage.putDirectory(`${newPrefix}thumbs/`, thumbsDir)).filter((o) => o.key.endsWith('.jpg'));

    const warnings = timeBase.warnings;
    await db.transaction(async (tx) => {
      const [current] = await tx.select({ status: clips.status }).from(clips).where(owned).for('update');
      if (!current || current.status !== 'extracting') throw new NotOwner();
      await tx.delete(clipFrames).where(eq(clipFrames.clipId, clip.id));
      for (let i = 0; i < rows.length; i += 2000) await tx.insert(clipFrames).values(rows.slice(i, i + 2000));
      await tx
        .update(clips)
        .set({
          status: 'ready',
          progress: 1,
          error: null,
          extractedCount: rows.length,
          thumbnailCount: thumbFiles.length,
          framesPrefix: newPrefix,
          variableFrameRate: timeBase.variableFrameRate,
          timeBaseWarnings: warnings,
          heartbeatAt: null,
          updatedAt: new Date(),
        })
        .where(owned);
    });
    const keep = newPrefix;
    newPrefix = null; // committed: it is the clip's frame set now
    // Committed already: a store hiccup here only delays the clean-up to the next extraction of this clip.
    await deleteOtherVersions(storage, clip.teamId, clip.id, keep).catch((err) => deps.log?.(`[jobs] clip ${clip.id}: old frame sets not yet removed (${(err as Error).message})`));
    deps.log?.(`[jobs] clip ${clip.id}: ${rows.length} frames extracted`);
  } catch (caught) {
    if (newPrefix) await storage.deletePrefix(newPrefix).catch(() => {});
    // The worker is stopping: give the job back (pg-boss retries it on another worker).
    const err = deps.stopping?.aborted ? new HandedBack('the worker stopped; the job was handed back') : caught;
    if (err instanceof CancelledError || err instanceof NotOwner) return;
    if (err instanceof HandedBack) {
      await db
        .update(clips)
        .set({ status: 'queued', progress: 0, heartbeatAt: null, updatedAt: new Date() })
        .where(and(owned, eq(clips.status, 'extracting')));
      throw err;
    }
    if (isStorageUnavailable(err)) {
      // The store is down: not the file's fault. Wait (visibly) and let pg-boss retry with backoff.
      const lastAttempt = (run.retryCount ?? 0) >= (run.retryLimit ?? 0);
      if (lastAttempt) {
        await markFailed(db, run, `Extraction stopped: the file store was unreachable on every attempt (${(err as Error).message}). Extract again once it is back.`);
        return;
      }
      await db
        .update(clips)
        .set({ status: 'queued', progress: 0, waitingFor: 'storage', error: `Waiting for the file store (${(err as Error).message}); retrying.`, heartbeatAt: null, updatedAt: new Date() })
        .where(and(owned, eq(clips.status, 'extracting')));
      throw err;
    }
    if (err instanceof MediaError) {
      // The file itself is the problem: retrying cannot help.
      await markFailed(db, run, `Could not extract frames: ${err.message}`);
      return;
    }
    const lastAttempt = (run.retryCount ?? 0) >= (run.retryLimit ?? 0);
    if (lastAttempt) {
      await markFailed(db, run, `Extraction failed: ${(err as Error).message}`);
      return;
    }
    await db
      .update(clips)
      .set({ status: 'queued', error: `Attempt ${(run.retryCount ?? 0) + 1} failed (${(err as Error).message}); retrying.`, heartbeatAt: null, updatedAt: new Date() })
      .where(and(owned, eq(clips.status, 'extracting')));
    throw err;
  } finally {
    clearInterval(heartbeat);
    deps.stopping?.removeEventListener('abort', onStop);
    await removeScratch(workDir);
  }
}

/**
 * An aborted ffmpeg may still be writing its last frames while the folder is
 * removed (the removal then fails on a folder that filled up again): retry a
 * few times until it is gone.
 */
async function removeScratch(dir: string): Promise<void> {
  for (let attempt = 0; attempt < 20; attempt++) {
    await rm(dir, { recursive: true, force: true }).catch(() => {});
    if (!existsSync(dir)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function markFailed(db: Db, run: ExtractionRun, error: string) {
  await db
    .update(clips)
    .set({ status: 'failed', error, waitingFor: null, heartbeatAt: null, updatedAt: new Date() })
    .where(and(eq(clips.id, run.clipId), eq(clips.jobId, run.jobId), inArray(clips.status, ['queued', 'extracting'])));
}

/** Removes frame sets of earlier extractions (and of runs killed before they committed). */
export async function deleteOtherVersions(storage: Storage, teamId: string, clipId: string, keepPrefix: string | null): Promise<void> {
  const base = clipPrefix(teamId, clipId);
  const versions = new Set<string>();
  for (const key of await storage.list(`${base}v-`)) versions.add(key.slice(0, key.indexOf('/', base.length) + 1));
  for (const prefix of versions) if (prefix !== keepPrefix) await storage.deletePrefix(prefix);
}

/** Runs an extraction in this process right away (the demo seed; no queue). */
export async function extractNow(deps: ExtractionDeps, clipId: string): Promise<void> {
  const jobId = randomUUID();
  await deps.db.update(clips).set({ jobId, status: 'queued', progress: 0 }).where(eq(clips.id, clipId));
  await runFrameExtraction(deps, { jobId, clipId });
}
