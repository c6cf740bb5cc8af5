import { asc, eq } from 'drizzle-orm';
import type { CalibrationTransform } from '../../shared/geometry/calibration-transform';
import { markTimeAndPlace } from '../../shared/marking/mark-world';
import type { Mark } from '../../shared/schemas/marking';
import type { Db } from '../db/client';
import { marks } from '../db/schema/marking';
import { users } from '../db/schema/users';
import { currentCalibrationRow, transformOf, type CalibrationRow } from './calibration-records';
import { loadFrameTimes } from './frame-times';
import type { ClipScope } from './scope';

export type MarkRow = typeof marks.$inferSelect;

export const markSelection = { mark: marks, updaterName: users.displayName };

/** Marks of a track with who last changed each, by frame. */
export async function loadMarkRows(db: Pick<Db, 'select'>, trackId: string) {
  return db.select(markSelection).from(marks).leftJoin(users, eq(users.id, marks.updatedBy)).where(eq(marks.trackId, trackId)).orderBy(asc(marks.frameNumber));
}

export interface MarkContext {
  calibration: CalibrationRow | null;
  transform: CalibrationTransform | null;
  frameTime: (frame: number) => number | null;
}

/** What a mark view needs besides the row: the clip's current calibration and frame times. */
export async function markContext(db: Pick<Db, 'select'>, clip: ClipScope, frameNumbers?: number[]): Promise<MarkContext> {
  const calibration = await currentCalibrationRow(db, clip.id);
  return { calibration, transform: calibration ? transformOf(calibration) : null, frameTime: await loadFrameTimes(db, clip, frameNumbers) };
}

export function markView(row: MarkRow, updaterName: string | null, ctx: MarkContext): Mark {
  return {
    frameNumber: row.frameNumber,
    uPx: row.uPx,
    vPx: row.vPx,
    placedUPx: row.placedUPx,
    placedVPx: row.placedVPx,
    snapped: row.snapped,
    source: row.source,
    confidence: row.confidence,
    lowConfidenceReason: row.lowConfidenceReason,
    revision: row.revision,
    updatedBy: row.updatedBy && updaterName !== null ? { id: row.updatedBy, displayName: updaterName } : null,
    updatedAt: row.updatedAt.toISOString(),
    ...markTimeAndPlace(row, ctx.transform, ctx.frameTime),
  };
}
