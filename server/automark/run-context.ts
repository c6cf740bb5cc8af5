// What one auto-mark attempt needs from the records: the track and its clip,
// the clip's extracted frame keys, the frame range, and the calibration's
// origin (the launch point) as a hint for finding the projectile.
import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import type { AutoMarkRequest } from '../db/schema/auto-mark';
import { clipFrames, clips } from '../db/schema/clips';
import { tracks } from '../db/schema/marking';
import { currentCalibrationRow } from '../marking/calibration-records';
import { TrackGone } from './auto-marks';
import type { StoredFrameKeys } from './frame-source';

/** The run cannot work on this clip as it stands; retrying would not help. */
export class RunInputError extends Error {}

export interface RunContext {
  frames: StoredFrameKeys;
  fromFrame: number;
  toFrame: number;
  originHint: { uPx: number; vPx: number } | null;
}

export async function loadRunContext(db: Db, trackId: string, request: AutoMarkRequest): Promise<RunContext> {
  const [row] = await db.select({ clip: clips }).from(tracks).innerJoin(clips, eq(clips.id, tracks.clipId)).where(eq(tracks.id, trackId));
  if (!row) throw new TrackGone();
  const { clip } = row;
  if (clip.status !== 'ready') throw new RunInputError(`the clip's frames are not ready (it is ${clip.status})`);
  const frameRows = await db
    .select({ frameNumber: clipFrames.frameNumber, storageKey: clipFrames.storageKey })
    .from(clipFrames)
    .where(and(eq(clipFrames.clipId, clip.id)))
    .orderBy(asc(clipFrames.frameNumber));
  if (frameRows.length === 0) throw new RunInputError('the clip has no extracted frames');
  const first = frameRows[0].frameNumber;
  const last = frameRows[frameRows.length - 1].frameNumber;
  const fromFrame = Math.max(first, request.fromFrame ?? first);
  const toFrame = Math.min(last, request.toFrame ?? last);
  if (fromFrame > toFrame) throw new RunInputError(`frames ${request.fromFrame}–${request.toFrame} are outside the extracted frames ${first}–${last}`);
  const calibration = await currentCalibrationRow(db, clip.id);
  return {
    frames: { keys: new Map(frameRows.map((f) => [f.frameNumber, f.storageKey])), frameCount: last + 1 },
    fromFrame,
    toFrame,
    originHint: calibration ? { uPx: calibration.originUPx, vPx: calibration.originVPx } : null,
  };
}
