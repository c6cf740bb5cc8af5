import { createHash } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { z } from 'zod';
import { CAN } from '../../shared/roles';
import { Uuid } from '../../shared/schemas/common';
import {
  ClipFrameImageParams,
  ClipIdParams,
  ClipFrameView,
  ClipPatchBody,
  ClipThumbnailParams,
  ClipUploadFields,
  ClipView,
  ShotClipParams,
} from '../../shared/schemas/clips';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { clipService, type StoredImage } from '../clips/clip-service';
import { receiveClipUpload, receivedFile } from '../clips/intake';
import { actorOf, currentTeam, currentUser, input } from '../http/input';
import { badRequest, notFound } from '../http/problem';
import { frameStoreUnavailable } from '../clips/intake';
import { isStorageUnavailable } from '../storage/storage';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { CLIP_UPLOAD_EXAMPLE } from '../http/api-examples';

const IMMUTABLE = 'private, max-age=31536000, immutable';

export function clipRoutes(api: RouteTable, deps: AppDeps) {
  const { storage, config } = deps;
  const service = clipService(deps);
  const shotClips = '/api/teams/:teamId/shots/:shotId/clips';
  const clip = '/api/teams/:teamId/clips/:clipId';

  api.get(shotClips, { summary: 'Clips of a shot, oldest first', response: z.array(ClipView) }, signedIn, teamRole(CAN.read), validate({ params: ShotClipParams }), listClips);
  api.post(
    shotClips,
    { summary: 'Upload a clip (multipart: file, captureFps, optional inFrame/outFrame, shutterS, frameStamp); extraction is queued', bodyType: 'multipart/form-data', status: 201, response: ClipView, example: CLIP_UPLOAD_EXAMPLE },
    signedIn,
    teamRole(CAN.editShots),
    requireShotOfTeam,
    receiveClipUpload(storage, config.uploadLimitBytes),
    validate({ params: ShotClipParams, body: ClipUploadFields }),
    uploadClip,
  );
  api.get(clip, { summary: 'A clip with its time base, warnings and extraction status (poll while extracting)', response: ClipView }, signedIn, teamRole(CAN.read), validate({ params: ClipIdParams }), getClip);
  api.patch(
    clip,
    { summary: 'Change the capture rate (times are recomputed), the in/out range (frames are re-extracted) or the exposure timing (shutter time, frame stamp)', response: ClipView },
    signedIn,
    teamRole(CAN.editShots),
    validate({ params: ClipIdParams, body: ClipPatchBody }),
    patchClip,
  );
  api.post(`${clip}/extract`, { summary: 'Extract the frames again', status: 202, response: ClipView }, signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), reExtract);
  api.post(`${clip}/cancel`, { summary: 'Cancel a queued or running extraction', response: ClipView }, signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), cancelExtraction);
  api.delete(clip, { summary: 'Delete a clip, its frames and its files', status: 204 }, signedIn, teamRole(CAN.editShots), validate({ params: ClipIdParams }), deleteClip);
  api.get(`${clip}/frames`, { summary: 'Extracted frames with their times and flags', response: z.array(ClipFrameView) }, signedIn, teamRole(CAN.read), validate({ params: ClipIdParams }), listFrames);
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
    if (!Uuid.safeParse(shotId).success || !(await service.shotIsTeams(currentTeam(res).id, shotId))) return next(notFound('No such shot in this team.'));
    next();
  }

  async function listClips(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotClipParams });
    res.json(await service.list(params.teamId, params.shotId));
  }

  async function uploadClip(req: Request, res: Response) {
    const { params, body } = input(res, { params: ShotClipParams, body: ClipUploadFields });
    const file = receivedFile(req);
    if (!file) throw badRequest('Attach the clip as the multipart field `file`.');
    res.status(201).json(await service.upload(file, { ...params, ...body, createdBy: currentUser(res).id }));
  }

  async function getClip(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    res.json(await service.view(params.teamId, params.clipId));
  }

  async function patchClip(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipIdParams, body: ClipPatchBody });
    res.json(await service.patch(actorOf(res), params.clipId, body));
  }

  async function reExtract(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    res.status(202).json(await service.reExtract(params.teamId, params.clipId));
  }

  async function cancelExtraction(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    res.json(await service.cancelExtraction(params.teamId, params.clipId));
  }

  async function deleteClip(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    await service.remove(actorOf(res), params.clipId);
    res.status(204).end();
  }

  async function listFrames(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipIdParams });
    res.json(await service.frames(params.teamId, params.clipId));
  }

  async function sendImage(req: Request, res: Response, image: StoredImage) {
    // Keys are versioned per extraction, so key + size names the bytes for good.
    const etag = `"${createHash('sha256').update(`${image.key}:${image.sizeBytes}`).digest('base64url').slice(0, 27)}"`;
    res.set({ ETag: etag, 'Cache-Control': IMMUTABLE, 'Content-Type': 'image/jpeg' });
    if (req.fresh) return void res.status(304).end();
    res.set('Content-Length', String(image.sizeBytes));
    const stream = await image.open().catch((err) => {
      // An error must not carry the year-long caching meant for the image.
      res.removeHeader('ETag');
      res.removeHeader('Cache-Control');
      res.removeHeader('Content-Length');
      throw isStorageUnavailable(err) ? frameStoreUnavailable() : notFound('The frame file is missing; extract the clip again.');
    });
    stream.on('error', () => res.destroy());
    stream.pipe(res);
  }

  async function frameImage(req: Request, res: Response) {
    const { params } = input(res, { params: ClipFrameImageParams });
    await sendImage(req, res, await service.frameImage(params.teamId, params.clipId, params.frameNumber));
  }

  async function thumbnailImage(req: Request, res: Response) {
    const { params } = input(res, { params: ClipThumbnailParams });
    await sendImage(req, res, await service.thumbnailImage(params.teamId, params.clipId, params.n));
  }
}
