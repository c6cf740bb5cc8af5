import { createHash } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { and, asc, eq, sql } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { Uuid } from '../../shared/schemas/common';
import {
  ClipFrameImageParams,
  ClipIdParams,
  ClipPatchBody,
  ClipThumbnailParams,
  ClipUploadFields,
  ShotClipParams,
  type ClipFrameView,
} from '../../shared/schemas/clips';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { loadClipView, loadClipViews } from '../clips/clip-view';
import { acceptUpload } from '../clips/accept-upload';
import { receiveClipUpload, receivedFile } from '../clips/intake';
import { clipFrames, clips } from '../db/schema/clips';
import { shots } from '../db/schema/records';
import { currentTeam, currentUser, input } from '../http/input';
import { HttpProblem, badRequest, conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { frameTimestamps, probe } from '../media/ffmpeg';
import { analyseTimeBase } from '../media/time-base';
import { clipPrefix } from '../storage/storage';

const IMMUTABLE = 'private, max-age=31536000, immutable';

export function clipRoutes(api: RouteTable, deps: AppDeps) {
  const { db, storage, config } = deps;
  const shotClips = '/api/teams/:teamId/shots/:shotId/clips';
  const clip = '/api/teams/:teamId/clips/:clipId';

  api.get(shotClips, 'Clips of a shot, oldest first', signedIn, teamRole(CAN.read), validate({ params: ShotClipParams }), listClips);
  api.post(
    shotClips,
    { summary: 'Upload a clip (multipart: file, captureFps, optional inFrame/outFrame); extraction is queued', bodyType: 'multipart/form-data', status: 201 },
    signedIn,
    teamRole(CAN.editShots),
    requireShotOfTeam,
    receiveClipUpload(storage, config.uploadLimitBytes),
    validate({ params: ShotClipParams, body: ClipUploadFields }),
    uploadClip,
  );
  api.get(clip, 'A clip with its time base, warnings and extraction status (poll while extracting)', signedIn, teamRole(CAN.read), validate({ params: ClipIdParams }), getClip);
  api.patch(
    clip,
    'Change the capture rate (times are recomputed) or the in/out range (frames are re-extracted)',
    signedIn,
    teamRole(CAN.editShots),
    validate({ params: ClipIdParams, body: ClipPatchBody }),
    patchClip,
  );
  api.post(`${clip}/extract`, { summary: 'Extract the frames again', status: 202 }, signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), reExtract);
  api.post(`${clip}/cancel`, 'Cancel a queued or running extraction', signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), cancelExtraction);
  api.delete(clip, { summary: 'Delete a clip, its frames and its files', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), deleteClip);
  api.get(`${clip}/frames`, 'Extracted frames with their times and flags', signedIn, teamRole(CAN.read), validate({ params: ClipIdParams }), listFrames);
  api.get(
    `${clip}/frames/:frameNumber/image`,
    { summary: 'One extracted frame as JPEG (strong ETag, immutable caching)', produces: 'image/jpeg' },
    signedIn,
    teamRole(CAN.read),
    validate({ params: ClipFrameImageParams }),
    frameImage,
  );
  api.get(
    `${clip}/thumbnails/:n/image`,
    { summary: 'Thumbnail n of the clip strip as JPEG', produces: 'image/jpeg' },
    signedIn,
    teamRole(CAN.read),
    validate({ params: ClipThumbnailParams }),
    thumbnailImage,
  );

  /** Checked before the upload streams, so a wrong shot does not cost a 2 GiB transfer. */
  async function requireShotOfTeam(req: Request, res: Response, next: NextFunction) {
    const shotId = String(req.params.shotId);
    if (!Uuid.safeParse(shotId).success) return next(notFound('No such shot in this team.'));
    const [shot] = await db.select({ id: shots.id }).from(shots).where(and(eq(shots.id, shotId), eq(shots.teamId, currentTeam(res).id)));
    if (!shot) return next(notFound('No such shot in this team.'));
    next();
  }

  async function findClip(teamId: string, clipId: string) {
    const [row] = await db.select().from(clips).where(and(eq(clips.id, clipId), eq(clips.teamId, teamId)));
    if (!row) throw notFound('No such clip in this team.');
    return row;
  }

  async function view(teamId: string, clipId: string) {
    const v = await loadClipView(db, teamId, clipId);
    if (!v) throw notFound('No such clip in this team.');
    return v;
  }

  async function listClips(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotClipParams });
    res.json(await loadClipViews(db, params.teamId, { shotId: params.shotId }));
  }

  async function uploadClip(req: Request, res: Response) {
    const { params, body } = input(res, { params: ShotClipParams, body: ClipUploadFields });
    const file = receivedFile(req);
    if (!file) throw badRequest('Attach the clip as the multipart field `file`.');
    const clipId = await acceptUpload(db, storage, file, { ...params, ...body, createdBy: currentUser(res).id });
    await enqueue(clipId);
    res.status(201).json(await view(params.teamId, clipId));
  }

  async function enqueue(clipId: string) {
    if (!deps.jobs) {
      await db.update(clips).set({ error: 'No job queue is running on this server; extraction waits for a worker.' }).where(eq(clips.id, clipId));
      return;
    }
    try {
      await deps.jobs.enqueueExtraction(clipId);
    } catch (err) {
      await db.update(clips).set({ status: 'failed', error: `Could not queue the extraction: ${(err as Error).message}` }).where(eq(clips.id, clipId));
    }
  }

  async function getClip(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    res.json(await view(params.teamId, params.clipId));
  }

  async function patchClip(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipIdParams, body: ClipPatchBody });
    const row = await findClip(params.teamId, params.clipId);
    const inFrame = body.inFrame ?? row.inFrame;
    const outFrame = body.outFrame ?? row.outFrame;
    if (inFrame > outFrame || outFrame > row.frameCount - 1) {
      throw badRequest(`The clip has ${row.frameCount} frames (0–${row.frameCount - 1}); inFrame ${inFrame} / outFrame ${outFrame} is outside it.`);
    }
    const captureFps = body.captureFps ?? row.captureFps;
    const rangeChanged = inFrame !== row.inFrame || outFrame !== row.outFrame;
    const rateChanged = captureFps !== row.captureFps;
    if (!rangeChanged && !rateChanged) return void res.json(await view(params.teamId, params.clipId));

    if (rangeChanged || row.status !== 'ready') {
      // New frames (or an extraction still to finish): let the job compute everything afresh.
      await db.update(clips).set({ inFrame, outFrame, captureFps, updatedAt: new Date() }).where(eq(clips.id, row.id));
      if (row.jobId) await deps.jobs?.cancel(row.jobId);
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
      const numbers = timeBase.frames.filter((f) => f.frameNumber >= row.inFrame && f.frameNumber <= row.outFrame);
      await db.transaction(async (tx) => {
        await tx.execute(sql`
          update clip_frames as f set t_s = v.t_s
          from unnest(${`{${numbers.map((f) => f.frameNumber).join(',')}}`}::int[], ${`{${numbers.map((f) => f.tS).join(',')}}`}::float8[]) as v(frame_number, t_s)
          where f.clip_id = ${row.id} and f.frame_number = v.frame_number`);
        await tx
          .update(clips)
          .set({ captureFps, variableFrameRate: timeBase.variableFrameRate, timeBaseWarnings: timeBase.warnings, updatedAt: new Date() })
          .where(eq(clips.id, row.id));
      });
    }
    await audit(db, {
      teamId: params.teamId,
      actorUserId: currentUser(res).id,
      action: 'clip.update',
      targetType: 'clip',
      targetId: row.id,
      detail: { captureFps, inFrame, outFrame },
    });
    res.json(await view(params.teamId, params.clipId));
  }

  async function reExtract(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    const row = await findClip(params.teamId, params.clipId);
    if (!deps.jobs) throw new HttpProblem(503, 'Job queue unavailable', 'No job queue is running on this server; try again shortly.');
    if (row.jobId) await deps.jobs.cancel(row.jobId);
    await enqueue(row.id);
    res.status(202).json(await view(params.teamId, params.clipId));
  }

  async function cancelExtraction(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    const row = await findClip(params.teamId, params.clipId);
    if (row.status !== 'queued' && row.status !== 'extracting') {
      throw conflict(`Nothing to cancel: the clip is ${row.status}.`);
    }
    await db.update(clips).set({ status: 'cancelled', progress: 0, heartbeatAt: null, updatedAt: new Date() }).where(eq(clips.id, row.id));
    if (row.jobId) await deps.jobs?.cancel(row.jobId);
    res.json(await view(params.teamId, params.clipId));
  }

  async function deleteClip(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    const row = await findClip(params.teamId, params.clipId);
    await db.transaction(async (tx) => {
      await tx.delete(clips).where(eq(clips.id, row.id));
      await audit(tx, {
        teamId: params.teamId,
        actorUserId: currentUser(res).id,
        action: 'clip.delete',
        targetType: 'clip',
        targetId: row.id,
        detail: { shotId: row.shotId, originalName: row.originalName },
      });
    });
    if (row.jobId) await deps.jobs?.cancel(row.jobId);
    await storage.deletePrefix(clipPrefix(row.teamId, row.id));
    res.status(204).end();
  }

  async function listFrames(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    await findClip(params.teamId, params.clipId);
    const rows = await db
      .select({ frameNumber: clipFrames.frameNumber, tS: clipFrames.tS, ptsS: clipFrames.ptsS, flag: clipFrames.flag })
      .from(clipFrames)
      .where(eq(clipFrames.clipId, params.clipId))
      .orderBy(asc(clipFrames.frameNumber));
    res.json(rows satisfies ClipFrameView[]);
  }

  async function sendImage(req: Request, res: Response, key: string, sizeBytes: number) {
    // Keys are versioned per extraction, so key + size names the bytes for good.
    const etag = `"${createHash('sha256').update(`${key}:${sizeBytes}`).digest('base64url').slice(0, 27)}"`;
    res.set({ ETag: etag, 'Cache-Control': IMMUTABLE, 'Content-Type': 'image/jpeg' });
    if (req.fresh) return void res.status(304).end();
    res.set('Content-Length', String(sizeBytes));
    const stream = await storage.get(key).catch(() => {
      throw notFound('The frame file is missing; extract the clip again.');
    });
    stream.on('error', () => res.destroy());
    stream.pipe(res);
  }

  async function frameImage(req: Request, res: Response) {
    const { params } = input(res, { params: ClipFrameImageParams });
    const [frame] = await db
      .select({ key: clipFrames.storageKey, size: clipFrames.sizeBytes })
      .from(clipFrames)
      .innerJoin(clips, eq(clips.id, clipFrames.clipId))
      .where(and(eq(clips.teamId, params.teamId), eq(clipFrames.clipId, params.clipId), eq(clipFrames.frameNumber, params.frameNumber)));
    if (!frame) throw notFound(`Frame ${params.frameNumber} of this clip has not been extracted.`);
    await sendImage(req, res, frame.key, frame.size);
  }

  async function thumbnailImage(req: Request, res: Response) {
    const { params } = input(res, { params: ClipThumbnailParams });
    const row = await findClip(params.teamId, params.clipId);
    if (!row.framesPrefix || params.n >= row.thumbnailCount) throw notFound(`No thumbnail ${params.n} for this clip.`);
    const key = `${row.framesPrefix}thumbs/thumb-${String(params.n).padStart(2, '0')}.jpg`;
    const stat = await storage.stat(key);
    if (!stat) throw notFound(`No thumbnail ${params.n} for this clip.`);
    await sendImage(req, res, key, stat.sizeBytes);
  }
}

