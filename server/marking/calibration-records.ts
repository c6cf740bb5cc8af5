import { desc, eq } from 'drizzle-orm';
import {
  buildCalibrationTransform,
  type CalibrationGeometry,
  type CalibrationTransform,
} from '../../shared/geometry/calibration-transform';
import type { z } from 'zod';
import type { Calibration, CalibrationCreateBody } from '../../shared/schemas/marking';
import type { Db } from '../db/client';
import { calibrations } from '../db/schema/marking';
import { users } from '../db/schema/users';
import { CLICK_SIGMA_PX } from '../../shared/defaults';
import { planeOffsetFactor, type PlaneOffsetInput } from '../../shared/geometry/plane-offset';
import type { LensCorrection } from '../../shared/schemas/camera';

function planeOffsetView(input: PlaneOffsetInput) {
  const r = planeOffsetFactor(input);
  return { factor: r.factor, relStdUncertainty: r.relStdUncertainty };
}

// The one place that turns calibration rows (flat columns) into geometry and
// API views. Anything that needs metres from a clip's marks (marks API, fits)
// should go through currentCalibrationRow + calibrationGeometryOf.

export type CalibrationRow = typeof calibrations.$inferSelect;
type CalibrationInput = z.output<typeof CalibrationCreateBody>;

export function calibrationGeometryOf(row: CalibrationRow): CalibrationGeometry {
  return {
    scale: {
      p1: { u: row.scaleP1UPx, v: row.scaleP1VPx },
      p2: { u: row.scaleP2UPx, v: row.scaleP2VPx },
      lengthM: row.lengthM,
      lengthTolM: row.lengthTolM,
      endpointSigmaPx: row.endpointSigmaPx,
    },
    origin: { u: row.originUPx, v: row.originVPx },
    level:
      row.levelKind === 'line'
        ? { kind: 'line', p1: { u: row.levelP1UPx!, v: row.levelP1VPx! }, p2: { u: row.levelP2UPx!, v: row.levelP2VPx! } }
        : { kind: 'angle', rollDeg: row.levelAngleDeg ?? 0 },
    downrange: row.downrange,
    plane: row.planeCorrection ? { corners: row.planeCorrection.corners, widthM: row.planeCorrection.widthM, heightM: row.planeCorrection.heightM } : null,
    lens: row.lens ? { k1: row.lens.k1, k2: row.lens.k2, frameWidthPx: row.lens.frameWidthPx, frameHeightPx: row.lens.frameHeightPx } : null,
    planeOffset: row.planeOffset,
    levelUncertainty: {
      ...(row.levelEndpointSigmaPx !== null ? { endpointSigmaPx: row.levelEndpointSigmaPx } : {}),
      ...(row.rollTolDeg !== null ? { rollTolDeg: row.rollTolDeg } : {}),
    },
  };
}

export function transformOf(row: CalibrationRow): CalibrationTransform {
  return buildCalibrationTransform(calibrationGeometryOf(row));
}

export async function currentCalibrationRow(db: Pick<Db, 'select'>, clipId: string): Promise<CalibrationRow | null> {
  const [row] = await db.select().from(calibrations).where(eq(calibrations.clipId, clipId)).orderBy(desc(calibrations.version)).limit(1);
  return row ?? null;
}

/** Column values for a new version, from the validated body, the transform it defines and the lens correction it states or fitted. */
export function calibrationValues(
  body: Omit<CalibrationInput, 'lens' | 'planeOffset' | 'levelUncertainty'> & Partial<Pick<CalibrationInput, 'planeOffset' | 'levelUncertainty'>>,
  transform: CalibrationTransform,
  lens: LensCorrection | null = null,
) {
  const level = body.level;
  return {
    scaleP1UPx: body.scale.p1.u,
    scaleP1VPx: body.scale.p1.v,
    scaleP2UPx: body.scale.p2.u,
    scaleP2VPx: body.scale.p2.v,
    lengthM: body.scale.lengthM,
    lengthTolM: body.scale.lengthTolM,
    endpointSigmaPx: body.scale.endpointSigmaPx,
    originUPx: body.origin.u,
    originVPx: body.origin.v,
    levelKind: level.kind,
    levelP1UPx: level.kind === 'line' ? level.p1.u : null,
    levelP1VPx: level.kind === 'line' ? level.p1.v : null,
    levelP2UPx: level.kind === 'line' ? level.p2.u : null,
    levelP2VPx: level.kind === 'line' ? level.p2.v : null,
    levelAngleDeg: level.kind === 'angle' ? level.rollDeg : null,
    downrange: body.downrange,
    rollDeg: transform.rollDeg,
    planeCorrection:
      body.plane && transform.homography
        ? { corners: body.plane.corners, widthM: body.plane.widthM, heightM: body.plane.heightM, homography: transform.homography }
        : null,
    pixelsPerMetre: transform.pixelsPerMetre,
    scaleRelUncertainty: transform.scaleRelUncertainty,
    lens,
    planeOffset: body.planeOffset
      ? {
        planeDistanceM: body.planeOffset.planeDistanceM,
        planeDistanceTolM: body.planeOffset.planeDistanceTolM,
        referenceOffsetM: body.planeOffset.referenceOffsetM,
        referenceOffsetTolM: body.planeOffset.referenceOffsetTolM,
      }
      : null,
    levelEndpointSigmaPx: level.kind === 'line' ? body.levelUncertainty?.endpointSigmaPx ?? CLICK_SIGMA_PX : null,
    rollTolDeg: level.kind === 'angle' ? body.levelUncertainty?.rollTolDeg ?? 0 : null,
    rollStdUncertaintyRad: transform.rollStdUncertaintyRad,
    note: body.note ?? null,
  };
}

/** The stored level uncertainty of the level in use; null where the version predates the columns. */
function levelUncertaintyView(row: CalibrationRow): Calibration['levelUncertainty'] {
  if (row.levelKind === 'line') return row.levelEndpointSigmaPx !== null ? { endpointSigmaPx: row.levelEndpointSigmaPx } : null;
  return row.rollTolDeg !== null ? { rollTolDeg: row.rollTolDeg } : null;
}

export function calibrationView(row: CalibrationRow, creatorName: string | null): Calibration {
  const g = calibrationGeometryOf(row);
  return {
    id: row.id,
    clipId: row.clipId,
    version: row.version,
    scale: g.scale,
    origin: g.origin,
    level: g.level,
    downrange: row.downrange,
    plane: row.planeCorrection,
    rollDeg: row.rollDeg,
    rollStdUncertaintyDeg: (row.rollStdUncertaintyRad * 180) / Math.PI,
    levelUncertainty: levelUncertaintyView(row),
    lens: row.lens,
    planeOffset: row.planeOffset ? { ...row.planeOffset, ...planeOffsetView(row.planeOffset) } : null,
    pixelsPerMetre: row.pixelsPerMetre,
    scaleRelUncertainty: row.scaleRelUncertainty,
    note: row.note,
    createdBy: row.createdBy && creatorName !== null ? { id: row.createdBy, displayName: creatorName } : null,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Calibration rows of a clip with their creators' names, newest version first. */
export async function listCalibrationViews(db: Db, clipId: string, limit?: number): Promise<Calibration[]> {
  const query = db
    .select({ row: calibrations, creatorName: users.displayName })
    .from(calibrations)
    .leftJoin(users, eq(users.id, calibrations.createdBy))
    .where(eq(calibrations.clipId, clipId))
    .orderBy(desc(calibrations.version));
  const rows = limit ? await query.limit(limit) : await query;
  return rows.map((r) => calibrationView(r.row, r.creatorName));
}
