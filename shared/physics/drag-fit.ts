// Quadratic-drag fit: joint nonlinear least squares of the x and y residuals
// of every mark. Parameters, in this order: x0 (m), y0 (m), launch speed (m/s),
// launch angle (rad), k (1/m), all at the time of the first mark.
//
// Not fitted: wind and a time offset. Over a clip of a second or less a
// steady wind and the drag constant are nearly indistinguishable, and the
// time origin is fixed by the first mark, so adding them would only inflate
// the intervals. k is left unconstrained (negative values are allowed) so its
// interval can honestly include zero.
import { STANDARD_GRAVITY_MPS2 } from './constants';
import { PositionSampler, type FlightModel, type LaunchState } from './flight';
import { leastSquares, type LeastSquaresResult } from './least-squares';
import type { FitMark } from './types';

/**
 * The drag fit's parameter vector, in the one ordering every file uses: the
 * launch state (same order as the flight state x, y, vx, vy, with the velocity
 * in polar form) followed by k. Arrays stay inside the optimiser and the
 * integrator; elsewhere read them by name with dragParamsOf.
 */
export const DRAG_PARAMETER_NAMES = ['x0M', 'y0M', 'launchSpeedMps', 'launchAngleRad', 'dragK_perM'] as const;
export type DragParameterName = (typeof DRAG_PARAMETER_NAMES)[number];
export type DragParams = Record<DragParameterName, number>;
/** Index of each parameter in the vector. */
export const DRAG_PARAM: { readonly [K in DragParameterName]: number } = { x0M: 0, y0M: 1, launchSpeedMps: 2, launchAngleRad: 3, dragK_perM: 4 };

/** A parameter vector (or its standard errors) as a named record. */
export function dragParamsOf(p: ArrayLike<number>): DragParams {
  return {
    x0M: p[DRAG_PARAM.x0M],
    y0M: p[DRAG_PARAM.y0M],
    launchSpeedMps: p[DRAG_PARAM.launchSpeedMps],
    launchAngleRad: p[DRAG_PARAM.launchAngleRad],
    dragK_perM: p[DRAG_PARAM.dragK_perM],
  };
}

/** The record back as a vector, in DRAG_PARAMETER_NAMES order. */
export function dragParamVector(d: DragParams): number[] {
  return DRAG_PARAMETER_NAMES.map((name) => d[name]);
}

export interface DragFitOptions {
  gravityMps2?: number;
  /** Start state [x0, y0, vx, vy] (flight-state order), normally the drag-free fit's. */
  startState: readonly [number, number, number, number];
  /** A plausible k for this body (from a handbook Cd); sets the step and scale for k near zero. */
  typicalK_perM: number;
  /** Steady along-plane wind, m/s, positive downrange (shared/physics/wind.ts); default calm. */
  windXMps?: number;
}

export interface DragFit {
  fit: LeastSquaresResult;
  tRefS: number;
  /** Evaluate the fitted model (or any parameter vector) at the mark times. */
  predict: (params: ArrayLike<number>) => { x: Float64Array; y: Float64Array };
}

export function launchFromParams(p: ArrayLike<number>): LaunchState {
  const speed = p[DRAG_PARAM.launchSpeedMps];
  const angle = p[DRAG_PARAM.launchAngleRad];
  return { xM: p[DRAG_PARAM.x0M], yM: p[DRAG_PARAM.y0M], vxMps: speed * Math.cos(angle), vyMps: speed * Math.sin(angle) };
}

const CBRT_EPS = Math.cbrt(Number.EPSILON);
const SQRT_EPS = Math.sqrt(Number.EPSILON);

export function fitQuadraticDrag(marks: FitMark[], options: DragFitOptions): DragFit {
  const n = marks.length;
  const g = options.gravityMps2 ?? STANDARD_GRAVITY_MPS2;
  const times = Float64Array.from(marks, (m) => m.tS);
  const sampler = new PositionSampler(times);
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const windXMps = options.windXMps ?? 0;
  const model = (p: ArrayLike<number>): FlightModel => ({ dragK_perM: p[DRAG_PARAM.dragK_perM], gravityMps2: g, windXMps });

  const observations = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { observations[i] = marks[i].xM; observations[n + i] = marks[i].yM; }
  const weights = marks.some((m) => m.sigmaM !== undefined)
    ? Float64Array.from({ length: 2 * n }, (_, i) => 1 / (marks[i % n].sigmaM as number))
    : undefined;

  const [sx0, sy0, svx, svy] = options.startState;
  const speed0 = Math.hypot(svx, svy);
  let extent = 0;
  for (const m of marks) extent = Math.max(extent, Math.abs(m.xM - sx0), Math.abs(m.yM - sy0));
  const typical = Float64Array.from(dragParamVector({
    x0M: Math.max(extent, 1e-3),
    y0M: Math.max(extent, 1e-3),
    launchSpeedMps: Math.max(speed0, 1e-3),
    launchAngleRad: 0.1,
    dragK_perM: Math.abs(options.typicalK_perM) || 1e-3,
  }));

  const write = (out: Float64Array) => {
    for (let i = 0; i < n; i++) { out[i] = xs[i]; out[n + i] = ys[i]; }
  };
  // Remember the step sequence of the last evaluation: the Jacobian that the
  // optimiser asks for next is usually at the same point, and can replay it
  // without integrating the base trajectory again.
  const lastP = new Float64Array(5).fill(Number.NaN);
  let lastSteps: number[] | undefined;
  const evaluate = (p: Float64Array, out: Float64Array) => {
    lastSteps = sampler.sample(model(p), launchFromParams(p), xs, ys);
    lastP.set(p);
    write(out);
  };
  // Jacobian by central differences on a frozen step sequence (see dp45.ts):
  // the base run records its steps and every perturbed run replays them.
  const plus = new Float64Array(2 * n);
  const minus = new Float64Array(2 * n);
  // While iterating, forward differences (half the integrations) steer well
  // enough; the final covariance uses central differences.
  const jacobian = (p: Float64Array, base: Float64Array, cols: Float64Array[], accurate: boolean) => {
    let same = lastSteps !== undefined;
    for (let j = 0; same && j < 5; j++) if (lastP[j] !== p[j]) same = false;
    let steps: number[] | undefined;
    if (same && !accurate) {
      steps = lastSteps;
      minus.set(base);
    } else {
      steps = sampler.sample(model(p), launchFromParams(p), xs, ys);
      if (!accurate) write(minus);
    }
    const q = Float64Array.from(p);
    for (let j = 0; j < 5; j++) {
      const h = (accurate ? CBRT_EPS : SQRT_EPS) * Math.max(Math.abs(p[j]), typical[j]);
      const hi = p[j] + h, lo = accurate ? p[j] - h : p[j];
      q[j] = hi; sampler.sample(model(q), launchFromParams(q), xs, ys, steps); write(plus);
      if (accurate) { q[j] = lo; sampler.sample(model(q), launchFromParams(q), xs, ys, steps); write(minus); }
      q[j] = p[j];
      const width = hi - lo;
      const col = cols[j];
      for (let i = 0; i < 2 * n; i++) col[i] = (plus[i] - minus[i]) / width;
    }
  };

  const fit = leastSquares(
    {
      observations,
      weights,
      model: evaluate,
      jacobian,
      start: dragParamVector({ x0M: sx0, y0M: sy0, launchSpeedMps: speed0, launchAngleRad: Math.atan2(svy, svx), dragK_perM: 0 }),
      typicalMagnitude: typical,
    },
    { maxIterations: 400, burstIterations: 3, rssRelTol: 1e-12, paramRelTol: 1e-9 },
  );

  return {
    fit,
    tRefS: times[0],
    predict: (params) => {
      const px = new Float64Array(n), py = new Float64Array(n);
      sampler.sample(model(params), launchFromParams(params), px, py);
      return { x: px, y: py };
    },
  };
}
