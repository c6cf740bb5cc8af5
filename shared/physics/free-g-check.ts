// A check of the time base and the scale: the quadratic-drag model with
// gravity left free (six parameters: x0, y0, launch speed, launch angle, k, g).
//
// Why inside the drag model: a drag-free parabola with free g absorbs the drag
// into g, so on any draggy shot its g sits far from 9.81 m/s² and raises an
// alarm about nothing. With drag in the model, g is what is left of the
// vertical acceleration once the speed-dependent part is accounted for, and it
// is off only when the seconds or the metres are: a frame rate wrong by a
// factor f scales g by f², a scale wrong by a factor s scales it by s.
//
// The machinery is the drag fit's: the same position sampler (frozen step
// sequences for smooth finite differences, dp45.ts) and the same least-squares
// driver; it starts from the fixed-g drag fit's answer.
import { estimate } from './estimate';
import { PositionSampler, type FlightModel } from './flight';
import { launchFromParams } from './drag-fit';
import { leastSquares } from './least-squares';
import type { Estimate, FitMark } from './types';

export const FREE_G_PARAMETER_NAMES = ['x0M', 'y0M', 'launchSpeedMps', 'launchAngleRad', 'dragK_perM', 'gravityMps2'] as const;

export interface FreeGravityOptions {
  /** The gravity the fit assumes (local g); the check compares against it. */
  statedGravityMps2: number;
  /** Start [x0, y0, speed, angle, k], normally the fixed-g drag fit's parameters. */
  start: [number, number, number, number, number];
  /** Plausible k for this body, sets the difference step near k = 0. */
  typicalK_perM: number;
  /** Steady along-plane wind, m/s (FlightModel.windXMps). */
  windXMps?: number;
  /**
   * Relative standard uncertainty of the scale. A scale error moves g one to
   * one, so it widens what counts as "far" — otherwise a clip with an honest
   * 1 % scale uncertainty would be flagged for a 1 % g.
   */
  scaleRelUncertainty?: number;
}

export interface FreeGravityCheck {
  /** g from the six-parameter fit; stdErr combines the statistical part and the scale's share. */
  gravityMps2: Estimate;
  statedGravityMps2: number;
  /** (g − g_stated) / u(g). */
  deviationSigmas: number;
  /** Plain-words caution when |g − g_stated| > 3 u(g), else null. */
  caution: string | null;
  converged: boolean;
}

const CBRT_EPS = Math.cbrt(Number.EPSILON);

export function freeGravityCheck(marks: FitMark[], options: FreeGravityOptions): FreeGravityCheck {
  const n = marks.length;
  const g0 = options.statedGravityMps2;
  const times = Float64Array.from(marks, (m) => m.tS);
  const sampler = new PositionSampler(times);
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const model = (p: ArrayLike<number>): FlightModel => ({ dragK_perM: p[4], gravityMps2: p[5], windXMps: options.windXMps ?? 0 });
  const observations = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { observations[i] = marks[i].xM; observations[n + i] = marks[i].yM; }
  const weights = marks.some((m) => m.sigmaM !== undefined)
    ? Float64Array.from({ length: 2 * n }, (_, i) => 1 / (marks[i % n].sigmaM as number))
    : undefined;
  const [x0, y0, speed] = options.start;
  let extent = 0;
  for (const m of marks) extent = Math.max(extent, Math.abs(m.xM - x0), Math.abs(m.yM - y0));
  const typical = [
    Math.max(extent, 1e-3), Math.max(extent, 1e-3), Math.max(speed, 1e-3), 0.1, Math.abs(options.typicalK_perM) || 1e-3, g0,
  ];
  const write = (out: Float64Array) => {
    for (let i = 0; i < n; i++) { out[i] = xs[i]; out[n + i] = ys[i]; }
  };
  const evaluate = (p: Float64Array, out: Float64Array) => {
    sampler.sample(model(p), launchFromParams(p), xs, ys);
    write(out);
  };
  // Central differences on the base run's step sequence (see drag-fit.ts).
  const plus = new Float64Array(2 * n);
  const minus = new Float64Array(2 * n);
  const jacobian = (p: Float64Array, _base: Float64Array, cols: Float64Array[]) => {
    const steps = sampler.sample(model(p), launchFromParams(p), xs, ys);
    const q = Float64Array.from(p);
    for (let j = 0; j < 6; j++) {
      const h = CBRT_EPS * Math.max(Math.abs(p[j]), typical[j]);
      q[j] = p[j] + h; sampler.sample(model(q), launchFromParams(q), xs, ys, steps); write(plus);
      q[j] = p[j] - h; sampler.sample(model(q), launchFromParams(q), xs, ys, steps); write(minus);
      q[j] = p[j];
      const width = 2 * h;
      for (let i = 0; i < 2 * n; i++) cols[j][i] = (plus[i] - minus[i]) / width;
    }
  };
  const fit = leastSquares(
    { observations, weights, model: evaluate, jacobian, start: [...options.start, g0], typicalMagnitude: typical },
    { maxIterations: 400, burstIterations: 3, rssRelTol: 1e-12, paramRelTol: 1e-9 },
  );
  const g = fit.params[5];
  const uStat = fit.stdErrors[5];
  const uScale = Math.abs(g) * (options.scaleRelUncertainty ?? 0);
  const u = Math.hypot(uStat, uScale);
  const gravityMps2 = estimate(g, u, fit.dof);
  const deviationSigmas = u > 0 ? (g - g0) / u : (g === g0 ? 0 : Number.POSITIVE_INFINITY * Math.sign(g - g0));
  let caution: string | null = null;
  if (!(Math.abs(g - g0) <= 3 * u)) {
    caution =
      `With gravity left free, the drag fit gives g = ${g.toFixed(2)} ± ${u.toFixed(2)} m/s² against the stated ${g0.toFixed(3)} m/s², ` +
      `${Math.abs(deviationSigmas).toFixed(1)} standard uncertainties away: check the capture frame rate and the scale.`;
  }
  return { gravityMps2, statedGravityMps2: g0, deviationSigmas, caution, converged: fit.converged };
}
