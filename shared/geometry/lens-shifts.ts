// The lens row of the uncertainty budget: how far each mark moves in the world
// when the lens coefficients move by one standard uncertainty.
//
// The coefficients come with a 2×2 covariance (from the plumb-line fit, or a
// stated profile's). It is split into two independent 1σ steps along its
// eigenvectors (systematic-shift.ts); for each step the whole pixel → world
// chain is rebuilt with the stepped coefficients — so the scale end points,
// the origin and the level line move with the marks, as they would with a
// real error in the coefficients — and the marks' world positions are
// differenced (central differences: ±step, halved).
import { independentSteps2, type MarkShift } from '../physics/systematic-shift';
import type { RadialCoefficients } from './lens-distortion';
import type { PixelPoint, WorldPoint } from './points';

export type WorldMapForLens = (coefficients: RadialCoefficients) => (p: PixelPoint) => WorldPoint;

export function lensMarkShifts(
  pixels: readonly PixelPoint[],
  coefficients: RadialCoefficients,
  covariance: readonly [readonly [number, number], readonly [number, number]],
  worldMapFor: WorldMapForLens,
): MarkShift[] {
  return independentSteps2(covariance)
    .filter(([a, b]) => a !== 0 || b !== 0)
    .map(([dk1, dk2]) => {
      const plus = worldMapFor({ k1: coefficients.k1 + dk1, k2: coefficients.k2 + dk2 });
      const minus = worldMapFor({ k1: coefficients.k1 - dk1, k2: coefficients.k2 - dk2 });
      const dxM: number[] = [];
      const dyM: number[] = [];
      for (const p of pixels) {
        const a = plus(p), b = minus(p);
        dxM.push((a.x - b.x) / 2);
        dyM.push((a.y - b.y) / 2);
      }
      return { dxM, dyM };
    });
}
