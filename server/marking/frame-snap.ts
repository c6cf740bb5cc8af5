import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { snapToCentroid } from '../../shared/marking/snap';
import type { SnapResult } from '../../shared/schemas/marking';
import type { Db } from '../db/client';
import { clipFrames } from '../db/schema/clips';
import { notFound } from '../http/problem';
import { readAll, type Storage } from '../storage/storage';
import { loadClip } from './scope';

export interface SnapRequest {
  clipId: string;
  frameNumber: number;
  uPx: number;
  vPx: number;
  windowPx?: number;
  dark?: boolean;
}

/**
 * The sub-pixel snap run on the stored frame image: the same shared function the
 * client runs on canvas pixels, here on the exact stored frame (no canvas resampling).
 */
export async function snapOnStoredFrame(db: Db, storage: Storage, teamId: string, q: SnapRequest): Promise<SnapResult> {
  const clip = await loadClip(db, teamId, q.clipId);
  const [frame] = await db
    .select({ storageKey: clipFrames.storageKey })
    .from(clipFrames)
    .where(and(eq(clipFrames.clipId, clip.id), eq(clipFrames.frameNumber, q.frameNumber)));
  if (!frame) throw notFound(`Frame ${q.frameNumber} has not been extracted for this clip.`);
  // The frame's bytes (a small JPEG) from whichever store holds them.
  const file = await readAll(storage, frame.storageKey);
  const { data, info } = await sharp(file).greyscale().raw().toBuffer({ resolveWithObject: true });
  const result = snapToCentroid({ width: info.width, height: info.height, channels: info.channels, data }, q.uPx, q.vPx, {
    windowPx: q.windowPx,
    dark: q.dark,
  });
  return { snapped: result ? { uPx: result.u, vPx: result.v, confidence: result.confidence } : null };
}
