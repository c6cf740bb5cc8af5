import { desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { buildCalibrationTransform } from '../../shared/geometry/calibration-transform';
import { GeometryError } from '../../shared/geometry/points';
import type { Calibration, CalibrationCreateBody } from '../../shared/schemas/marking';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { calibrations } from '../db/schema/marking';
import { badRequest } from '../http/problem';
import { calibrationValues, listCalibrationViews } from './calibration-records';
import { lensCorrectionOf } from './lens-correction';
import { resolveLensProfile } from './lens-from-profile';
import { loadClip } from './scope';
import type { LensCorrection } from '../../shared/schemas/camera';

// Calibration versions of a clip: scale reference, origin, level and optional
// plane correction. Never edited in place: each change is a new version, so a
// fit can always say which calibration its metres came from.

/** All calibration versions of the team's clip, newest first. */
export async function clipCalibrations(db: Db, teamId: string, clipId: string): Promise<Calibration[]> {
  const clip = await loadClip(db, teamId, clipId);
  return listCalibrationViews(db, clip.id);
}

/** The clip's current calibration, or null when it has none. */
export async function currentClipCalibration(db: Db, teamId: string, clipId: string): Promise<Calibration | null> {
  const clip = await loadClip(db, teamId, clipId);
  const [latest] = await listCalibrationViews(db, clip.id, 1);
  return latest ?? null;
}

/** Stores a new calibration version; geometry that cannot calibrate is a 400 on the field at fault. */
export async function calibrateClip(db: Db, actor: Actor, clipId: string, body: z.output<typeof CalibrationCreateBody>): Promise<Calibration | undefined> {
  const clip = await loadClip(db, actor.teamId, clipId);
  let transform;
  let lens: LensCorrection | null;
  try {
    // The lens's normalised radius refers to the served (upright) frame, as the clicks do.
    const [size] = await db.select({ width: clips.width, height: clips.height, rotationDeg: clips.rotationDeg }).from(clips).where(eq(clips.id, clip.id));
    const turned = size.rotationDeg === 90 || size.rotationDeg === 270;
    const frame = { widthPx: turned ? size.height : size.width, heightPx: turned ? size.width : size.height };
    const named = await resolveLensProfile(db, actor.teamId, body.lens, frame);
    lens = lensCorrectionOf(named.input, frame);
    if (lens && named.profile) lens = { ...lens, source: 'profile', profile: named.profile };
    transform = buildCalibrationTransform({
      ...body,
      lens: lens ? { k1: lens.k1, k2: lens.k2, frameWidthPx: lens.frameWidthPx, frameHeightPx: lens.frameHeightPx } : null,
    });
  } catch (err) {
    if (err instanceof GeometryError) throw badRequest(err.message, { errors: [{ path: `body.${err.field}`, message: err.message }] });
    throw err;
  }
  const id = await db.transaction(async (tx) => {
    // Locking the clip row serialises version numbers per clip.
    await tx.select({ id: clips.id }).from(clips).where(eq(clips.id, clip.id)).for('update');
    const [last] = await tx.select({ version: calibrations.version }).from(calibrations).where(eq(calibrations.clipId, clip.id)).orderBy(desc(calibrations.version)).limit(1);
    const version = (last?.version ?? 0) + 1;
    const [row] = await tx
      .insert(calibrations)
      .values({ clipId: clip.id, version, ...calibrationValues(body, transform, lens), createdBy: actor.userId })
      .returning({ id: calibrations.id });
    await audit(tx, {
      teamId: actor.teamId,
      actorUserId: actor.userId,
      action: 'calibration.create',
      targetType: 'clip',
      targetId: clip.id,
      detail: {
        calibrationId: row.id, version, pixelsPerMetre: transform.pixelsPerMetre, planeCorrection: body.plane !== null,
        lens: lens ? lens.source : null, planeOffset: body.planeOffset !== null,
      },
    });
    return row.id;
  });
  const views = await listCalibrationViews(db, clip.id);
  return views.find((v) => v.id === id);
}
