// Between the editor's calibration draft, the API's Calibration and the
// shared transform. The transform itself lives in shared/geometry, so the
// client shows exactly the world coordinates the server stores.
import { CLICK_SIGMA_PX } from '@shared/defaults';
import { buildCalibrationTransform, type CalibrationGeometry, type CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { Calibration, CalibrationCreateBody } from '@shared/schemas/marking';
import type { CalibrationDraft } from './types';

/** A draft becomes usable once it has a scale and an origin; without a level line the camera is taken as level. */
export function draftToGeometry(draft: CalibrationDraft): CalibrationGeometry | null {
  if (!draft.scale || !draft.origin) return null;
  return {
    scale: { ...draft.scale, endpointSigmaPx: CLICK_SIGMA_PX },
    origin: draft.origin,
    level: draft.level ?? { kind: 'angle', rollDeg: 0 },
    downrange: draft.downrange,
    plane: draft.plane,
  };
}

export function draftToCreateBody(draft: CalibrationDraft, note?: string): CalibrationCreateBody | null {
  const g = draftToGeometry(draft);
  if (!g) return null;
  return {
    scale: g.scale,
    origin: g.origin,
    level: g.level,
    downrange: g.downrange,
    plane: draft.plane ? { corners: draft.plane.corners, widthM: draft.plane.widthM, heightM: draft.plane.heightM } : null,
    ...(note ? { note } : {}),
  };
}

export function calibrationToDraft(c: Calibration): CalibrationDraft {
  return {
    scale: { p1: c.scale.p1, p2: c.scale.p2, lengthM: c.scale.lengthM, lengthTolM: c.scale.lengthTolM },
    origin: c.origin,
    level: c.level,
    downrange: c.downrange,
    plane: c.plane ? { corners: c.plane.corners, widthM: c.plane.widthM, heightM: c.plane.heightM } : null,
  };
}

export type TransformResult = { ok: true; transform: CalibrationTransform } | { ok: false; message: string } | null;

/** The transform of a draft, a readable reason it has none, or null when it is not complete yet. */
export function transformOfDraft(draft: CalibrationDraft): TransformResult {
  const g = draftToGeometry(draft);
  if (!g) return null;
  try {
    return { ok: true, transform: buildCalibrationTransform(g) };
  } catch (err) {
    return { ok: false, message: err instanceof Error ? err.message : String(err) };
  }
}

/** Same calibration, reading "no level given" as the 0° roll it is saved as. */
export function sameDraft(a: CalibrationDraft, b: CalibrationDraft): boolean {
  const g = (d: CalibrationDraft) => JSON.stringify(draftToGeometry(d) ?? d);
  return g(a) === g(b);
}
