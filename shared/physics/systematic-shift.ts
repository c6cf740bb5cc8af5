// What a systematic error in the mark positions does to the fitted numbers.
//
// A calibration input known only to within its standard uncertainty (the lens
// coefficients, the roll, …) moves every mark together, in a pattern fixed by
// the geometry: a roll error turns all marks about the origin, a lens error
// pulls them towards or away from the image centre. Such an error does not
// average out over the marks the way click scatter does, so it gets its own
// row in the budget.
//
// First order (GUM JCGM 100:2008 §5.1.2, sensitivity coefficients): when the
// observations y of a least-squares fit move by Δy, its parameters move by the
// weighted least-squares solution of J Δp = Δy, J the fit's Jacobian at the
// solution (the same linearisation the fit's covariance rests on). Each source
// is given as independent 1σ components (a correlated pair such as k1, k2 is
// split along the eigenvectors of its covariance first); the source's standard
// uncertainty on a result is the root sum of squares of its components' shifts.
import { RAD_TO_DEG } from './estimate';
import { cdFromDragK } from './flight';
import { DRAG_PARAM } from './drag-fit';
import { linearLeastSquares } from './linear-least-squares';
import type { LeastSquaresResult } from './least-squares';
import type { FitMark } from './types';

/** One independent 1σ component of a systematic source: how far each mark moves, m. */
export interface MarkShift {
  dxM: ArrayLike<number>;
  dyM: ArrayLike<number>;
}

/** The headline numbers' response to one shift. */
export interface HeadlineShift {
  launchSpeedMps: number;
  launchAngleDeg: number;
  dragK_perM: number;
}

function weightsOf(marks: readonly FitMark[]): number[] | undefined {
  if (!marks.some((m) => m.sigmaM !== undefined)) return undefined;
  const w = marks.map((m) => 1 / (m.sigmaM as number));
  return [...w, ...w];
}

function stacked(shift: MarkShift, n: number): number[] {
  const dy = new Array<number>(2 * n);
  for (let i = 0; i < n; i++) { dy[i] = shift.dxM[i]; dy[n + i] = shift.dyM[i]; }
  return dy;
}

/** Δp of a least-squares fit whose observations move by dy: the weighted LS solution of J Δp = dy. */
export function linearisedParameterShift(jacobianRows: number[][], dy: number[], weights?: number[]): number[] {
  return linearLeastSquares(jacobianRows, dy, weights).params;
}

/** Response of the quadratic-drag fit (observations x_1…x_n, y_1…y_n) to one mark shift. */
export function dragFitShift(fit: LeastSquaresResult, marks: readonly FitMark[], shift: MarkShift): HeadlineShift {
  const dp = linearisedParameterShift(fit.jacobian, stacked(shift, marks.length), weightsOf(marks));
  return {
    launchSpeedMps: dp[DRAG_PARAM.launchSpeedMps],
    launchAngleDeg: dp[DRAG_PARAM.launchAngleRad] * RAD_TO_DEG,
    dragK_perM: dp[DRAG_PARAM.dragK_perM],
  };
}

/**
 * Response of the drag-free parabola (g fixed; parameters x0, vx, y0, vy at
 * tRef, the design of drag-free-fit.ts) to one mark shift. Linear, so exact.
 */
export function dragFreeShift(marks: readonly FitMark[], tRefS: number, velocity: { vxMps: number; vyMps: number }, shift: MarkShift): HeadlineShift {
  const design: number[][] = [];
  for (const m of marks) design.push([1, m.tS - tRefS, 0, 0]);
  for (const m of marks) design.push([0, 0, 1, m.tS - tRefS]);
  const [, dvx, , dvy] = linearisedParameterShift(design, stacked(shift, marks.length), weightsOf(marks));
  const { vxMps: vx, vyMps: vy } = velocity;
  const speed = Math.hypot(vx, vy);
  return {
    launchSpeedMps: (vx * dvx + vy * dvy) / speed,
    launchAngleDeg: ((vx * dvy - vy * dvx) / (speed * speed)) * RAD_TO_DEG,
    dragK_perM: 0,
  };
}

/** The 1σ shift of a roll uncertainty: every mark turned about the world origin by σ (roll-uncertainty.ts). */
export function rollMarkShift(marks: readonly FitMark[], rollSigmaRad: number): MarkShift {
  return { dxM: marks.map((m) => m.yM * rollSigmaRad), dyM: marks.map((m) => -m.xM * rollSigmaRad) };
}

/**
 * The 1σ shift of a scale uncertainty (relative, e.g. 0.004): every mark's
 * distance from the origin grows by that share. With gravity fixed, a scaled
 * path is not just a bigger copy of the fitted one (it is the path under a
 * scaled g), so the fit answers by moving the angle and k a little as well as
 * the speed: propagating the shift catches all three.
 */
export function scaleMarkShift(marks: readonly FitMark[], relSigma: number): MarkShift {
  return { dxM: marks.map((m) => m.xM * relSigma), dyM: marks.map((m) => m.yM * relSigma) };
}

/** A source's standard uncertainty on each headline number: root sum of squares over its independent components. */
export function combineShifts(shifts: readonly HeadlineShift[]): HeadlineShift {
  const rss = (pick: (s: HeadlineShift) => number) => Math.sqrt(shifts.reduce((a, s) => a + pick(s) ** 2, 0));
  return {
    launchSpeedMps: rss((s) => s.launchSpeedMps),
    launchAngleDeg: rss((s) => s.launchAngleDeg),
    dragK_perM: rss((s) => s.dragK_perM),
  };
}

/** Cd's standard uncertainty from k's, for one source. */
export function cdShift(dragK_perM: number, diameterM: number, massKg: number, airDensityKgM3: number): number {
  return Math.abs(cdFromDragK(dragK_perM, diameterM, massKg, airDensityKgM3));
}

/**
 * Split a 2×2 covariance (e.g. of k1, k2) into two independent 1σ steps along
 * its eigenvectors: stepping the pair by each gives the source's components.
 */
export function independentSteps2(cov: readonly [readonly [number, number], readonly [number, number]]): [number, number][] {
  const a = cov[0][0], b = cov[0][1], d = cov[1][1];
  const tr = a + d;
  const disc = Math.sqrt(Math.max(0, ((a - d) / 2) ** 2 + b * b));
  const l1 = Math.max(0, tr / 2 + disc);
  const l2 = Math.max(0, tr / 2 - disc);
  let e1: [number, number];
  if (Math.abs(b) > 1e-300) e1 = [l1 - d, b];
  else e1 = a >= d ? [1, 0] : [0, 1];
  const norm = Math.hypot(e1[0], e1[1]);
  e1 = [e1[0] / norm, e1[1] / norm];
  const e2: [number, number] = [-e1[1], e1[0]];
  return [
    [Math.sqrt(l1) * e1[0], Math.sqrt(l1) * e1[1]],
    [Math.sqrt(l2) * e2[0], Math.sqrt(l2) * e2[1]],
  ];
}
