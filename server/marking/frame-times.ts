import { and, asc, eq, inArray } from 'drizzle-orm';
import { frameTimeS } from '../../shared/marking/frame-time';
import type { Db } from '../db/client';
import { clipFrames } from '../db/schema/clips';
import type { ClipScope } from './scope';

/**
 * Frame times in capture seconds by the one rule (shared/marking/frame-time.ts)
 * over the clip's frame table. `frameNumbers` limits the lookup; omit it to load the whole table.
 */
export async function loadFrameTimes(db: Pick<Db, 'select'>, clip: ClipScope, frameNumbers?: number[]): Promise<(frame: number) => number | null> {
  const times = new Map<number, number>();
  if (!frameNumbers || frameNumbers.length > 0) {
    const rows = await db
      .select({ frameNumber: clipFrames.frameNumber, tS: clipFrames.tS })
      .from(clipFrames)
      .where(frameNumbers ? and(eq(clipFrames.clipId, clip.id), inArray(clipFrames.frameNumber, frameNumbers)) : eq(clipFrames.clipId, clip.id));
    for (const r of rows) times.set(r.frameNumber, r.tS);
  }
  return (frame) => frameTimeS(frame, times.get(frame), clip.captureFps);
}

export interface FrameMatch {
  frame: number | null;
  /** Why no frame matched, for a line error. */
  reason?: string;
}

/**
 * Finds the frame a world-file time belongs to. A time must fall within a
 * quarter of a frame interval of a frame's time: looser would silently put a
 * file made at another frame rate onto the wrong frames.
 */
export async function frameMatcher(db: Pick<Db, 'select'>, clip: ClipScope): Promise<(tS: number) => FrameMatch> {
  const rows = await db
    .select({ frameNumber: clipFrames.frameNumber, tS: clipFrames.tS })
    .from(clipFrames)
    .where(eq(clipFrames.clipId, clip.id))
    .orderBy(asc(clipFrames.tS));
  const interval = 1 / clip.captureFps;
  const tolerance = interval / 4;
  if (rows.length === 0) {
    return (tS) => {
      const frame = Math.round(tS / interval);
      if (Math.abs(tS - frame * interval) > tolerance) return { frame: null, reason: `t_s ${tS} is not within a quarter frame of any frame at ${clip.captureFps} fps` };
      if (frame >= clip.frameCount) return { frame: null, reason: `t_s ${tS} is after the clip's last frame` };
      return { frame };
    };
  }
  return (tS) => {
    // Binary search for the nearest frame time.
    let lo = 0;
    let hi = rows.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (rows[mid].tS <= tS) lo = mid;
      else hi = mid;
    }
    const best = Math.abs(rows[lo].tS - tS) <= Math.abs(rows[hi].tS - tS) ? rows[lo] : rows[hi];
    if (Math.abs(best.tS - tS) > tolerance) return { frame: null, reason: `t_s ${tS} matches no frame of the clip (nearest is frame ${best.frameNumber} at ${best.tS} s)` };
    return { frame: best.frameNumber };
  };
}
