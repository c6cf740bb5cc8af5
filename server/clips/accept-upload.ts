// The upload handler's work once multer has streamed the file into the store:
// inspect it where it lies, check the range, record the clip. Anything that
// fails leaves the object unkept, and receiveClipUpload deletes it.
import type { FrameStampPosition } from '../../shared/physics/exposure-timing';
import type { Db } from '../db/client';
import { HttpProblem, badRequest } from '../http/problem';
import { isStorageUnavailable, type Storage } from '../storage/storage';
import { checkDecodedPixels, checkTeamQuota, type ExtractionLimits } from './extraction-limits';
import { inspectClip, storageUnavailable, type ReceivedFile } from './intake';
import { storeClip } from './store-clip';

export interface UploadRequest {
  teamId: string;
  shotId: string;
  captureFps: number;
  inFrame?: number;
  outFrame?: number;
  shutterS?: number | null;
  frameStamp?: FrameStampPosition;
  createdBy: string | null;
  /** The pixel cap and team quota (config); checked before the clip is recorded, so no frame is ever written. */
  limits?: ExtractionLimits;
}

/** Returns the new clip's id (status 'queued'); throws problem+json errors for bad files and 503 when the store is down. */
export async function acceptUpload(db: Db, storage: Storage, file: ReceivedFile, r: UploadRequest): Promise<string> {
  const originalName = (file.originalname || 'clip').slice(0, 255);
  try {
    let facts;
    try {
      facts = await inspectClip(await storage.mediaInput(file.key), file.size, originalName, file.head);
    } catch (err) {
      // ffprobe reading over the network cannot tell a damaged file from a store that went away: ask the store.
      if (err instanceof HttpProblem && storage.kind !== 'local') await storage.stat(file.key);
      throw err;
    }
    const inFrame = r.inFrame ?? 0;
    const outFrame = r.outFrame ?? facts.frameCount - 1;
    if (outFrame > facts.frameCount - 1 || inFrame > outFrame) {
      throw badRequest(`The clip has ${facts.frameCount} frames (0–${facts.frameCount - 1}); inFrame ${inFrame} / outFrame ${outFrame} is outside it.`);
    }
    if (r.limits) {
      checkDecodedPixels({ frames: outFrame - inFrame + 1, width: facts.probe.width, height: facts.probe.height, maxDecodedPixels: r.limits.maxDecodedPixels });
      await checkTeamQuota(db, r.teamId, file.size, r.limits.teamStorageQuotaBytes);
    }
    const clipId = await storeClip(db, storage, {
      teamId: r.teamId,
      shotId: r.shotId,
      file: { clipId: file.clipId, key: file.key },
      facts,
      originalName,
      sha256: file.sha256,
      sizeBytes: file.size,
      captureFps: r.captureFps,
      inFrame,
      outFrame,
      shutterS: r.shutterS,
      frameStamp: r.frameStamp,
      createdBy: r.createdBy,
    });
    file.kept = true;
    return clipId;
  } catch (err) {
    if (!(err instanceof HttpProblem) && isStorageUnavailable(err)) throw storageUnavailable();
    throw err;
  }
}
