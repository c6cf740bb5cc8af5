// How well the camera roll is known, and what that does to the results.
//
// Clicked level line p1 → p2 (length L px): the roll is θ = atan2(−Δv, Δu).
// Moving an end point by δ changes θ only through δ's component n·δ across the
// line (n the unit normal), by n·δ / L; along the line it changes nothing.
// With each end point clicked independently with standard uncertainty σ px in
// every direction, ∂θ/∂p2 = n/L and ∂θ/∂p1 = −n/L, so (GUM, JCGM 100:2008,
// eq. 10, uncorrelated inputs)
//     u²(θ) = (σ/L)² + (σ/L)²   ⇒   u(θ) = √2 · σ / L  radians.
// A roll stated as a number ± a tolerance is a rectangular distribution, u = a/√3.
//
// Propagation: an error δ in the roll rotates every world point about the
// origin by −δ (calibration-transform.ts, step 3): ∂x/∂δ = y, ∂y/∂δ = −x. It
// rotates every velocity the same way, so the launch angle carries the roll's
// uncertainty one to one and the speed (a length per time) none. Its effect on
// the drag (gravity no longer exactly "down" in the rotated frame) is found by
// refitting with the marks rotated by ±u(θ): rotateWorldPoints below.
import { rectangularStdUncertainty } from '../uncertainty/gum';
import { distancePx, GeometryError, type PixelPoint, type WorldPoint } from './points';

export const DEG_PER_RAD = 180 / Math.PI;

/** Standard uncertainty of the roll from a clicked level line, radians. */
export function levelLineRollSigmaRad(p1: PixelPoint, p2: PixelPoint, endpointSigmaPx: number): number {
  const lengthPx = distancePx(p1, p2);
  if (!(lengthPx >= 1)) throw new GeometryError('Level line points must be at least 1 px apart.', 'level.p2');
  if (!(endpointSigmaPx >= 0 && Number.isFinite(endpointSigmaPx))) {
    throw new GeometryError('The level click uncertainty must be 0 or more pixels.', 'level.endpointSigmaPx');
  }
  return (Math.SQRT2 * endpointSigmaPx) / lengthPx;
}

/**
 * The same through a correction that bends or stretches the picture (lens,
 * plane homography): the clicks' σ is in frame pixels, the roll is measured on
 * the corrected points, so each click's σ is carried through the correction's
 * local Jacobian (GUM eq. 10 with sensitivity coefficients by central differences).
 */
export function correctedLevelLineRollSigmaRad(
  p1: PixelPoint, p2: PixelPoint, endpointSigmaPx: number, correct: (p: PixelPoint) => PixelPoint,
): number {
  levelLineRollSigmaRad(p1, p2, endpointSigmaPx);
  const angle = (a: PixelPoint, b: PixelPoint) => {
    const qa = correct(a), qb = correct(b);
    return Math.atan2(-(qb.v - qa.v), qb.u - qa.u);
  };
  const base = angle(p1, p2);
  const h = 1e-3;
  let sum = 0;
  for (const which of [0, 1]) {
    for (const axis of ['u', 'v'] as const) {
      const bump = (d: number) => {
        const a = { ...p1 }, b = { ...p2 };
        (which === 0 ? a : b)[axis] += d;
        // Unwrap against the base angle so a line near ±180° differentiates smoothly.
        let t = angle(a, b) - base;
        t -= 2 * Math.PI * Math.round(t / (2 * Math.PI));
        return t;
      };
      const d = (bump(h) - bump(-h)) / (2 * h);
      sum += d * d;
    }
  }
  return endpointSigmaPx * Math.sqrt(sum);
}

/** Standard uncertainty of a stated roll with a ± tolerance in degrees, radians. */
export function statedRollSigmaRad(rollToleranceDeg: number): number {
  if (!(rollToleranceDeg >= 0 && rollToleranceDeg < 45)) {
    throw new GeometryError('The roll tolerance must be between 0 and 45 degrees.', 'level.rollTolDeg');
  }
  return rectangularStdUncertainty(rollToleranceDeg) / DEG_PER_RAD;
}

/** Standard uncertainty the roll adds to the launch angle, degrees (one to one). */
export function launchAngleSigmaFromRollDeg(rollSigmaRad: number): number {
  return rollSigmaRad * DEG_PER_RAD;
}

/** Standard uncertainty the roll adds to one world point's coordinates, m (first order). */
export function worldPointSigmaFromRoll(w: WorldPoint, rollSigmaRad: number): { sigmaXM: number; sigmaYM: number } {
  return { sigmaXM: Math.abs(w.y) * rollSigmaRad, sigmaYM: Math.abs(w.x) * rollSigmaRad };
}

/**
 * World points as they come out when the roll used is off by deltaRad
 * (positive: the roll used is larger than the true one). Exact rotation, for
 * sensitivity refits.
 */
export function rotateWorldPoints<T extends { xM: number; yM: number }>(points: readonly T[], deltaRad: number): T[] {
  const c = Math.cos(deltaRad);
  const s = Math.sin(deltaRad);
  return points.map((p) => ({ ...p, xM: c * p.xM + s * p.yM, yM: -s * p.xM + c * p.yM }));
}
