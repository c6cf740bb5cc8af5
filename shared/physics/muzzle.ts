// Muzzle back-extrapolation: follow the fitted flight from the first mark to
// the muzzle's x position and report the speed there.
//
// Integrating backwards uses time reversal: with s = -t and u = -v the flight
// equation a = -k|v - w|(v - w) - g y_hat becomes du/ds = +k|u + w|(u + w) - g y_hat,
// i.e. the same equation with k -> -k, w -> -w and the velocity negated. So
// the forward integrator (which needs tEnd > t0) serves both directions.
import { flightConstants, flightRhs } from './flight';
import { integrateDp45 } from './dp45';
import { DRAG_PARAM, launchFromParams } from './drag-fit';

export interface MuzzleCrossing {
  speedMps: number;
  /** Time of the crossing relative to the launch state (negative: before it). */
  dtS: number;
  yM: number;
}

const TOL = { rtol: 1e-12, atol: 1e-12 };
/** Give up beyond this: a muzzle more than this far back in time is not part of the same shot. */
const MAX_EXTRAPOLATION_S = 10;

/** Crossing of x = muzzleXM for a drag-fit parameter vector (DRAG_PARAMETER_NAMES order); null if never reached. */
export function muzzleCrossing(params: ArrayLike<number>, gravityMps2: number, muzzleXM: number): MuzzleCrossing | null {
  const l = launchFromParams(params);
  const k = params[DRAG_PARAM.dragK_perM];
  const backwards = (muzzleXM - l.xM) * l.vxMps < 0;
  if (muzzleXM === l.xM) return { speedMps: Math.hypot(l.vxMps, l.vyMps), dtS: 0, yM: l.yM };
  const sign = backwards ? -1 : 1;
  const c = flightConstants({ dragK_perM: sign * k, gravityMps2 });
  const run = integrateDp45(
    flightRhs, 0, [l.xM, l.yM, sign * l.vxMps, sign * l.vyMps], MAX_EXTRAPOLATION_S, TOL, undefined,
    { fn: (_t, s) => s[0] - muzzleXM, direction: 0 }, undefined, c,
  );
  if (!run.eventFound) return null;
  const [, yM, vx, vy] = run.yEnd; // flight state order: x, y, vx, vy
  return { speedMps: Math.hypot(vx, vy), dtS: sign * run.tEnd, yM };
}

/** Gradient of the muzzle speed with respect to the fit parameters, by central differences. */
export function muzzleSpeedGradient(
  params: ArrayLike<number>, gravityMps2: number, muzzleXM: number, typical: ArrayLike<number>,
): number[] | null {
  const grad: number[] = [];
  const q = Array.from(params);
  for (let j = 0; j < q.length; j++) {
    // Larger step than the fit's: the event location adds noise of ~1e-12 relative.
    const h = 1e-5 * Math.max(Math.abs(params[j]), typical[j]);
    q[j] = params[j] + h;
    const up = muzzleCrossing(q, gravityMps2, muzzleXM);
    q[j] = params[j] - h;
    const down = muzzleCrossing(q, gravityMps2, muzzleXM);
    q[j] = params[j];
    if (!up || !down) return null;
    grad.push((up.speedMps - down.speedMps) / (2 * h));
  }
  return grad;
}
