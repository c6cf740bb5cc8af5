// Between the editor's calibration draft, the API's Calibration and the
// shared transform. The transform itself lives in shared/geometry, so the
// client shows exactly the world coordinates the server stores.
import { CLICK_SIGMA_PX } from '@shared/defaults';
import { buildCalibrationTransform, type CalibrationGeometry, type CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { LensInput } from '@shared/schemas/camera';
import type { Calibration, CalibrationCreateBody } from '@shared/schemas/marking';
import type { CalibrationDraft, LensDraft } from './types';

/** A draft becomes usable once it has a scale and an origin; without a level line the camera is taken as level. */
export function draftToGeometry(draft: CalibrationDraft): CalibrationGeometry | null {
  if (!draft.scale || !draft.origin) return null;
  return {
    scale: { ...draft.scale, endpointSigmaPx: CLICK_SIGMA_PX },
    origin: draft.origin,
    level: draft.level ?? { kind: 'angle', rollDeg: 0 },
    downrange: draft.downrange,
    plane: draft.plane,
    lens: draft.lens ? { k1: draft.lens.k1, k2: draft.lens.k2, frameWidthPx: draft.lens.frameWidthPx, frameHeightPx: draft.lens.frameHeightPx } : null,
    planeOffset: planeOffsetOf(draft),
    levelUncertainty: draft.levelUncertainty,
  };
}

/** In one key order, so drafts compare equal however the offset was typed. */
function planeOffsetOf({ planeOffset: o }: CalibrationDraft) {
  return o
    ? { planeDistanceM: o.planeDistanceM, planeDistanceTolM: o.planeDistanceTolM, referenceOffsetM: o.referenceOffsetM, referenceOffsetTolM: o.referenceOffsetTolM }
    : null;
}

/**
 * What the server is asked for: fitted edges are sent as edges (the server fits
 * them again with the same shared code and stores its own answer), stated
 * coefficients as stated.
 */
export function lensInputOf(lens: LensDraft | null): LensInput | null {
  if (!lens) return null;
  if (lens.source === 'straight-lines' && lens.straightLines) return { straightLines: lens.straightLines, clickSigmaPx: CLICK_SIGMA_PX };
  // The server copies the profile's coefficients as they are when the version is saved.
  if (lens.source === 'profile' && lens.profile) return { profileId: lens.profile.id };
  return { coefficients: { k1: lens.k1, k2: lens.k2, k1StdUnc: lens.k1StdUnc, k2StdUnc: lens.k2StdUnc, k1k2Correlation: lens.k1k2Correlation } };
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
    lens: lensInputOf(draft.lens),
    planeOffset: g.planeOffset ?? null,
    levelUncertainty: draft.levelUncertainty,
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
    straightLines: c.lens?.straightLines ?? [],
    lens: c.lens,
    planeOffset: c.planeOffset
      ? {
          planeDistanceM: c.planeOffset.planeDistanceM,
          planeDistanceTolM: c.planeOffset.planeDistanceTolM,
          referenceOffsetM: c.planeOffset.referenceOffsetM,
          referenceOffsetTolM: c.planeOffset.referenceOffsetTolM,
        }
      : null,
    levelUncertainty: c.levelUncertainty,
  };
}

/** Six significant figures: enough for a typed σ or tolerance, so drafts compare equal however the number was typed. */
const typed = (x: number) => Number(x.toPrecision(6));

/** The level uncertainty a draft stands for, defaults filled in (a line: the usual click σ; a stated roll: ± 0). */
export function effectiveLevelUncertainty(draft: CalibrationDraft): { endpointSigmaPx: number } | { rollTolDeg: number } {
  const lu = draft.levelUncertainty;
  if (draft.level?.kind === 'line') return { endpointSigmaPx: typed(lu?.endpointSigmaPx ?? CLICK_SIGMA_PX) };
  return { rollTolDeg: typed(lu?.rollTolDeg ?? 0) };
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

/**
 * Same calibration, reading "no level given" as the 0° roll it is saved as.
 * The lens is compared by what would be sent (edges or stated coefficients),
 * not by fitted numbers, and straight edges clicked but not fitted are no
 * change to the calibration yet.
 */
export function sameDraft(a: CalibrationDraft, b: CalibrationDraft): boolean {
  const g = (d: CalibrationDraft) => {
    const geometry = draftToGeometry(d);
    const { straightLines: _unfitted, ...rest } = d;
    return JSON.stringify(
      geometry
        ? { ...geometry, lens: lensInputOf(d.lens), levelUncertainty: effectiveLevelUncertainty(d) }
        : { ...rest, lens: lensInputOf(d.lens), levelUncertainty: effectiveLevelUncertainty(d) },
    );
  };
  return g(a) === g(b);
}
