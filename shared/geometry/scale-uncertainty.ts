// Pixels per metre from a scale reference, with its relative standard
// uncertainty, following the GUM (JCGM 100:2008):
//  - a stated length tolerance ±a is taken as a rectangular (uniform)
//    distribution, standard uncertainty a/√3 (§4.3.7);
//  - each end point is placed with standard uncertainty σ px along the
//    reference, so the pixel length L_px = |p2 − p1| has u = √(σ² + σ²) = √2·σ;
//  - ppm = L_px / L is a quotient, so relative uncertainties add in
//    quadrature (§5.1.6, law of propagation for products and quotients).
// This is the only place a scale reference becomes an uncertainty: calibrations
// (through buildCalibrationTransform) and fitShot's `uncertainties.scale` both use it.
import { rectangularStdUncertainty } from '../uncertainty/gum';

/** A scale reference reduced to what its uncertainty depends on (the wire type with end points is ScaleReference in shared/schemas/marking.ts). */
export interface ScaleInput {
  /** Distance between the two end points, pixels (after any plane correction). */
  lengthPx: number;
  lengthM: number;
  /** Stated tolerance ±a of the length: a half-width, not a standard uncertainty. */
  lengthTolM: number;
  /** Standard uncertainty of placing each end point, pixels. */
  endpointSigmaPx: number;
}

export interface ScaleResult {
  pixelsPerMetre: number;
  /** u(ppm)/ppm. */
  relStdUncertainty: number;
  /** u(ppm), pixels per metre. */
  stdUncertainty: number;
  /** Relative contributions before combination, for display. */
  lengthRel: number;
  pixelRel: number;
}

export function scaleWithUncertainty({ lengthPx, lengthM, lengthTolM, endpointSigmaPx }: ScaleInput): ScaleResult {
  if (!(lengthPx > 0)) throw new RangeError('scale reference has zero pixel length');
  if (!(lengthM > 0)) throw new RangeError('scale length must be positive');
  const pixelsPerMetre = lengthPx / lengthM;
  const lengthRel = rectangularStdUncertainty(lengthTolM) / lengthM;
  const pixelRel = (Math.SQRT2 * endpointSigmaPx) / lengthPx;
  const relStdUncertainty = Math.hypot(lengthRel, pixelRel);
  return { pixelsPerMetre, relStdUncertainty, stdUncertainty: relStdUncertainty * pixelsPerMetre, lengthRel, pixelRel };
}
