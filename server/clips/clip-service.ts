import type { Readable } from 'node:stream';
import { and, asc, eq, sql } from 'drizzle-orm';
import type { z } from 'zod';
import { shutterProblem } from '../../shared/physics/exposure-timing';
import type { ClipFrameView, ClipPatchBody, ClipView } from '../../shared/schemas/clips';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Tx } from '../db/client';
import { clipFrames, clips } from '../db/schema/clips';
import { shots } from '../db/schema/records';
import { HttpProblem, badRequest, conflict, notFound } from '../http/problem';
import { frameTimestamps, probe } from '../media/ffmpeg';
import { analyseTimeBase } from '../media/time-base';
import { clipPrefix, isStorageUnavailable } from '../storage/storage';
import { acceptUpload, type UploadRequest } from './accept-upload';
import { checkDecodedPixels, type ExtractionLimits } from './extraction-limits';
import { loadClipView, loadClipViews } from './clip-view';
import { frameStoreUnavailable, type ReceivedFile } from './intake';

/** A stored JPEG (frame or thumbnail): its key and size name the bytes for good. */
export interface StoredImage {
  key: string;
  sizeBytes: number;
  open: () => Promise<Readable>;
}

type ClipDeps = Pick<AppDeps, 'db' | 'storage' | 'jobs'> & { config?: ExtractionLimits };

/** Rewrites the time of each listed frame in one statement (an update joined to two unnested arrays). */
async function rewriteFrameTimes(tx: Tx, clipId: string, frames: { frameNumber: number; tS: number }[]) {
  await tx.execute(sql`
    update clip_frames as f set t_s = v.t_s
    from unnest(${`{${frames.map((f) => f.frameNumber).join(',')}}`}::int[], ${`{${frames.map((f) => f.tS).join(',')}}`}::float8[]) as v(frame_number, t_s)
    where f.clip_id = ${clipId} and f.frame_number = v.frame_number`);
}

/**
 * Clips of a shot: upload, time base, frame extraction (queued as a job),
 * re-timing, cancelling and deleting with their files, and the stored images.
 */
export function clipService({ db, storage, jobs, config }: ClipDeps) {
  // The pixel cap and team quota (config); refused before anything is decoded.
  const limits: ExtractionLimits | undefined = config && { maxDecodedPixels: config.maxDecodedPixels, teamStorageQuotaBytes: config.teamStorageQuotaBytes };
  async function findClip(teamId: string, clipId: string) {
    const [row] = await db.select().from(clips).where(and(eq(clips.id, clipId), eq(clips.teamId, teamId)));
    if (!row) throw notFound('No such clip in this team.');
    return row;
  }

  async function view(teamId: string, clipId: string): Promise<ClipView> {
    const v = await loadClipView(db, teamId, clipId);
    if (!v) throw notFound('No such clip in this team.');
    return v;
  }

  /** Queues the extraction; without a queue (or when queueing fails) the clip says why instead. */
  async function enqueue(clipId: string) {
    if (!jobs) {
      await db.update(clips).set({ error: 'No job queue is running on this server; extraction waits for a worker.' }).where(eq(clips.id, clipId));
      return;
    }
    try {
      await jobs.enqueueExtraction(clipId);
    } catch (err) {
      await db.update(clips).set({ status: 'failed', error: `Could not queue the extraction: ${(err as Error).message}` }).where(eq(clips.id, clipId));
    }
  }

  async function image(key: string, sizeBytes: number): Promise<StoredImage> {
    return { key, sizeBytes, open: () => storage.get(key) };
  }

  return {
    view,

    /** Whether the shot is the team's (checked before an upload streams). */
    async shotIsTeams(teamId: string, shotId: string): Promise<boolean> {
      const [shot] = await db.select({ id: shots.id }).from(shots).where(and(eq(shots.id, shotId), eq(shots.teamId, teamId)));
      return Boolean(shot);
    },

    /** Clips of a shot, oldest first. */
    list: (teamId: string, shotId: string) => loadClipViews(db, teamId, { shotId }),

    /** Records an uploaded clip and queues its extraction. */
    async upload(file: ReceivedFile, r: UploadRequest): Promise<ClipView> {
      const clipId = await acceptUpload(db, storage, file, { ...r, limits: r.limits ?? limits });
      await enqueue(clipId);
      return view(r.teamId, clipId);
    },

    /**
     * A new capture rate re-times the frames from the file's timestamps; a new
     * in/out range (or an extraction still to finish) extracts again.
     */
    async patch(actor: Actor, clipId: string, body: z.output<typeof ClipPatchBody>): Promise<ClipView> {
      const row = await findClip(actor.teamId, clipId);
      const inFrame = body.inFrame ?? row.inFrame;
      const outFrame = body.outFrame ?? row.outFrame;
      if (inFrame > outFrame || outFrame > row.frameCount - 1) {
        throw badRequest(`The clip has ${row.frameCount} frames (0–${row.frameCount - 1}); inFrame ${inFrame} / outFrame ${outFrame} is outside it.`);
      }
      const captureFps = body.captureFps ?? row.captureFps;
      const shutterS = body.shutterS === undefined ? row.shutterS : body.shutterS;
      const frameStamp = body.frameStamp ?? row.frameStamp;
      // A frame cannot be exposed for longer than the time between frames; the field at fault is the one sent.
      const shutterTooLong = shutterS === null ? null : shutterProblem(shutterS, captureFps);
      if (shutterTooLong) {
        const path = body.shutterS !== undefined ? 'body.shutterS' : 'body.captureFps';
        throw badRequest(shutterTooLong, { errors: [{ path, message: shutterTooLong }] });
      }
      const rangeChanged = inFrame !== row.inFrame || outFrame !== row.outFrame;
      const rateChanged = captureFps !== row.captureFps;
      const exposureChanged = shutterS !== row.shutterS || frameStamp !== row.frameStamp;
      if (!rangeChanged && !rateChanged && !exposureChanged) return view(actor.teamId, clipId);

      if (!rangeChanged && !rateChanged) {
        // Exposure timing only: the frames and their times stay; the fit reads it.
        await db.transaction(async (tx) => {
          await tx.update(clips).set({ shutterS, frameStamp, updatedAt: new Date() }).where(eq(clips.id, row.id));
          await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'clip.update', targetType: 'clip', targetId: row.id, detail: { shutterS, frameStamp } });
        });
        return view(actor.teamId, clipId);
      }

      if (rangeChanged && limits) checkDecodedPixels({ frames: outFrame - inFrame + 1, width: row.width, height: row.height, maxDecodedPixels: limits.maxDecodedPixels });
      if (rangeChanged || row.status !== 'ready') {
        // New frames (or an extraction still to finish): let the job compute everything afresh.
        await db.update(clips).set({ inFrame, outFrame, captureFps, shutterS, frameStamp, updatedAt: new Date() }).where(eq(clips.id, row.id));
        if (row.jobId) await jobs?.cancel(row.jobId);
        await enqueue(row.id);
      } else {
        // Same frames, new clock: recompute every frame time from the file's timestamps.
        let pts = row.framePtsS;
        let baseFps = row.baseFps;
        if (!pts || !(baseFps > 0)) {
          const file = await storage.mediaInput(row.storageKey);
          baseFps = (await probe(file)).baseFps;
          pts = await frameTimestamps(file);
        }
        const timeBase = analyseTimeBase({ ptsS: pts, containerFps: row.containerFps, baseFps, captureFps });
        const frames = timeBase.frames.filter((f) => f.frameNumber >= row.inFrame && f.frameNumber <= row.outFrame);
        await db.transaction(async (tx) => {
          await rewriteFrameTimes(tx, row.id, frames);
          await tx
            .update(clips)
            .set({ captureFps, shutterS, frameStamp, variableFrameRate: timeBase.variableFrameRate, timeBaseWarnings: timeBase.warnings, updatedAt: new Date() })
            .where(eq(clips.id, row.id));
        });
      }
      await audit(db, { teamId: actor.teamId, actorUserId: actor.userId, action: 'clip.update', targetType: 'clip', targetId: row.id, detail: { captureFps, inFrame, outFrame, shutterS, frameStamp } });
      return view(actor.teamId, clipId);
    },

    /** Extracts the frames again (503 without a job queue). */
    async reExtract(teamId: string, clipId: string): Promise<ClipView> {
      const row = await findClip(teamId, clipId);
      if (!jobs) throw new HttpProblem(503, 'Job queue unavailable', 'No job queue is running on this server; try again shortly.');
      if (row.jobId) await jobs.cancel(row.jobId);
      await enqueue(row.id);
      return view(teamId, clipId);
    },

    /** Cancels a queued or running extraction (409 when there is none). */
    async cancelExtraction(teamId: string, clipId: string): Promise<ClipView> {
      const row = await findClip(teamId, clipId);
      if (row.status !== 'queued' && row.status !== 'extracting') {
        throw conflict(`Nothing to cancel: the clip is ${row.status}.`);
      }
      await db.update(clips).set({ status: 'cancelled', progress: 0, heartbeatAt: null, updatedAt: new Date() }).where(eq(clips.id, row.id));
      if (row.jobId) await jobs?.cancel(row.jobId);
      return view(teamId, clipId);
    },

    /** Deletes the clip, its frames (cascade) and its files. */
    async remove(actor: Actor, clipId: string): Promise<void> {
      const row = await findClip(actor.teamId, clipId);
      await db.transaction(async (tx) => {
        await tx.delete(clips).where(eq(clips.id, row.id));
        await audit(tx, {
          teamId: actor.teamId,
          actorUserId: actor.userId,
          action: 'clip.delete',
          targetType: 'clip',
          targetId: row.id,
          detail: { shotId: row.shotId, originalName: row.originalName },
        });
      });
      if (row.jobId) await jobs?.cancel(row.jobId);
      await storage.deletePrefix(clipPrefix(row.teamId, row.id));
    },

    /** Extracted frames with their times and flags. */
    async frames(teamId: string, clipId: string): Promise<ClipFrameView[]> {
      await findClip(teamId, clipId);
      return db
        .select({ frameNumber: clipFrames.frameNumber, tS: clipFrames.tS, ptsS: clipFrames.ptsS, flag: clipFrames.flag })
        .from(clipFrames)
        .where(eq(clipFrames.clipId, clipId))
        .orderBy(asc(clipFrames.frameNumber));
    },

    async frameImage(teamId: string, clipId: string, frameNumber: number): Promise<StoredImage> {
      const [frame] = await db
        .select({ key: clipFrames.storageKey, size: clipFrames.sizeBytes })
        .from(clipFrames)
        .innerJoin(clips, eq(clips.id, clipFrames.clipId))
        .where(and(eq(clips.teamId, teamId), eq(clipFrames.clipId, clipId), eq(clipFrames.frameNumber, frameNumber)));
      if (!frame) throw notFound(`Frame ${frameNumber} of this clip has not been extracted.`);
      return image(frame.key, frame.size);
    },

    async thumbnailImage(teamId: string, clipId: string, n: number): Promise<StoredImage> {
      const row = await findClip(teamId, clipId);
      if (!row.framesPrefix || n >= row.thumbnailCount) throw notFound(`No thumbnail ${n} for this clip.`);
      const key = `${row.framesPrefix}thumbs/thumb-${String(n).padStart(2, '0')}.jpg`;
      const stat = await storage.stat(key).catch((err) => {
        throw isStorageUnavailable(err) ? frameStoreUnavailable() : err;
      });
      if (!stat) throw notFound(`No thumbnail ${n} for this clip.`);
      return image(key, stat.sizeBytes);
    },
  };
}
