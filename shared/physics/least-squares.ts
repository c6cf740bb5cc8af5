// Generic nonlinear least squares: a thin wrapper around ml-levenberg-marquardt
// that adds what that library leaves to the caller:
//  - Marquardt-style scaling: each restart re-parameterises p = p_c + s * u with
//    s_j = 1 / ||dr/dp_j||, so the library's plain (lambda * I) damping acts like
//    lambda * diag(J^T J) and its absolute damping limits (1e-7..1e7) mean the
//    same thing on every problem;
//  - central-difference Jacobians with steps relative to each parameter;
//  - residual weighting done here (the library's own weights enter the error
//    and the step inconsistently, so they are not used);
//  - restarts: the library accepts uphill steps and only tracks the best point,
//    so it is run in short bursts, each restarted from the best point so far,
//    until the sum of squares and the parameters stop changing;
//  - covariance from a QR of the Jacobian at the solution (not the normal
//    equations, which square the condition number).
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { householderQr, inverseNormalFromR } from './linear-least-squares';

/** Writes the model prediction for every observation into out. */
export type ModelFunction = (params: Float64Array, out: Float64Array) => void;
/**
 * Writes d(prediction)/d(param_j) into columns[j]. accurate is true for the
 * final covariance; during iterations a cheaper (e.g. forward-difference)
 * Jacobian is enough because it only steers the steps.
 */
export type JacobianFunction = (params: Float64Array, base: Float64Array, columns: Float64Array[], accurate: boolean) => void;

export interface LeastSquaresProblem {
  observations: ArrayLike<number>;
  /** Residual i is multiplied by weights[i] (use 1/sigma_i). */
  weights?: ArrayLike<number>;
  model: ModelFunction;
  /** Optional Jacobian; defaults to central differences of model. */
  jacobian?: JacobianFunction;
  start: ArrayLike<number>;
  /** Magnitude below which a parameter counts as "near zero" (floor for relative steps). */
  typicalMagnitude?: ArrayLike<number>;
}

export interface LeastSquaresOptions {
  /** Total Levenberg-Marquardt iterations over all restarts. */
  maxIterations?: number;
  /** Iterations per burst between restarts. */
  burstIterations?: number;
  /** Stop when the relative drop of the sum of squares over a burst is below this... */
  rssRelTol?: number;
  /** ...and no parameter moved by more than this relative amount. */
  paramRelTol?: number;
}

export interface LeastSquaresResult {
  params: number[];
  /** Weighted residual sum of squares. */
  rss: number;
  dof: number;
  /** s^2 = RSS / (N - p). */
  residualVariance: number;
  stdErrors: number[];
  covariance: number[][];
  correlation: number[][];
  /** Unweighted residuals, observation minus prediction. */
  residuals: number[];
  /** Jacobian of the predictions at the solution (N x p, row-major per observation). */
  jacobian: number[][];
  iterations: number;
  restarts: number;
  /** Burst test met and the residual is orthogonal to the Jacobian (cosine < 1e-4). */
  converged: boolean;
  /** Largest cosine between the weighted residual and a Jacobian column (0 at an exact minimum). */
  maxGradientCosine: number;
  /** Smallest singular value over largest of the weighted, column-scaled Jacobian. */
  inverseCondition: number;
}

const CBRT_EPS = Math.cbrt(Number.EPSILON);

/** Central differences with step cbrt(eps) * max(|p_j|, typical_j): balances truncation and rounding. */
export function centralDifferenceJacobian(
  model: ModelFunction, params: Float64Array, typical: ArrayLike<number>, columns: Float64Array[],
): void {
  const n = columns[0].length;
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  const p = Float64Array.from(params);
  for (let j = 0; j < params.length; j++) {
    const h = CBRT_EPS * Math.max(Math.abs(params[j]), typical[j]);
    const hi = params[j] + h;
    const lo = params[j] - h;
    p[j] = hi; model(p, plus);
    p[j] = lo; model(p, minus);
    p[j] = params[j];
    const col = columns[j];
    const width = hi - lo; // the representable step, not 2h
    for (let i = 0; i < n; i++) col[i] = (plus[i] - minus[i]) / width;
  }
}

function sumSquares(obs: ArrayLike<number>, pred: Float64Array, w: ArrayLike<number> | undefined): number {
  let s = 0;
  for (let i = 0; i < pred.length; i++) {
    const r = (obs[i] - pred[i]) * (w ? w[i] : 1);
    s += r * r;
  }
  return s;
}

export function leastSquares(problem: LeastSquaresProblem, options: LeastSquaresOptions = {}): LeastSquaresResult {
  const n = problem.observations.length;
  const np = problem.start.length;
  if (n <= np) throw new RangeError(`least squares needs more observations (${n}) than parameters (${np})`);
  const maxIterations = options.maxIterations ?? 3000;
  const burst = options.burstIterations ?? 12;
  const rssRelTol = options.rssRelTol ?? 1e-14;
  const paramRelTol = options.paramRelTol ?? 1e-10;
  const obs = problem.observations;
  const w = problem.weights;
  const typical = Float64Array.from(
    problem.typicalMagnitude ?? Array.from(problem.start, (v) => (v === 0 ? 1 : Math.abs(v) * 1e-6)),
  );
  const rawJac: JacobianFunction =
    problem.jacobian ?? ((p, _base, cols) => centralDifferenceJacobian(problem.model, p, typical, cols));
  // The Jacobian used for scaling at a restart is the one the library asks for
  // first, so remember the last one by its exact parameter vector.
  const lastJacP = new Float64Array(np).fill(Number.NaN);
  const lastJacCols = Array.from({ length: np }, () => new Float64Array(n));
  let lastJacAccurate = false;
  const jac: JacobianFunction = (p, base, cols, accurate) => {
    let hit = accurate ? lastJacAccurate : true;
    for (let j = 0; hit && j < np; j++) if (lastJacP[j] !== p[j]) hit = false;
    if (!hit) {
      rawJac(p, base, lastJacCols, accurate);
      lastJacP.set(p);
      lastJacAccurate = accurate;
    }
    for (let j = 0; j < np; j++) cols[j].set(lastJacCols[j]);
  };

  const columns = Array.from({ length: np }, () => new Float64Array(n));
  const pred = new Float64Array(n);
  let p: Float64Array = Float64Array.from(problem.start);
  problem.model(p, pred);
  let rss = sumSquares(obs, pred, w);
  if (!Number.isFinite(rss)) throw new Error('least squares: model is not finite at the start values');

  let iterations = 0;
  let restarts = 0;
  let converged = false;
  let quietBursts = 0;
  let startDamping = 1e-2;
  const dataX = Array.from({ length: n }, (_, i) => i);
  const scale = new Float64Array(np);
  const infinite = new Array(np).fill(Number.POSITIVE_INFINITY);
  const negInfinite = new Array(np).fill(Number.NEGATIVE_INFINITY);

  const maxRestarts = Math.ceil(maxIterations / burst) + 20;
  let polishDamping = 1e-6;
  let nextRobustShort = false;
  let shortCheckImproved = false;
  while (iterations < maxIterations && restarts < maxRestarts) {
    // Scale each parameter by its current column norm (Marquardt scaling).
    jac(p, pred, columns, false);
    for (let j = 0; j < np; j++) {
      let norm = 0;
      const col = columns[j];
      for (let i = 0; i < n; i++) {
        const v = col[i] * (w ? w[i] : 1);
        norm += v * v;
      }
      norm = Math.sqrt(norm);
      scale[j] = norm > 0 && Number.isFinite(norm) ? 1 / norm : Math.max(Math.abs(p[j]), typical[j]);
    }
    const centre = Float64Array.from(p);
    const toParams = (u: ArrayLike<number>, target: Float64Array) => {
      for (let j = 0; j < np; j++) target[j] = centre[j] + scale[j] * u[j];
      return target;
    };

    // Cache: the library asks for the same parameter vector several times.
    const cacheU = new Float64Array(np).fill(Number.NaN);
    const cachePred = new Float64Array(n);
    const cacheCols = Array.from({ length: np }, () => new Float64Array(n));
    const jacU = new Float64Array(np).fill(Number.NaN);
    const work = new Float64Array(np);
    const same = (a: Float64Array, b: ArrayLike<number>) => {
      for (let j = 0; j < np; j++) if (a[j] !== b[j]) return false;
      return true;
    };
    const evalAt = (u: number[]) => {
      if (!same(cacheU, u)) {
        problem.model(toParams(u, work), cachePred);
        for (let j = 0; j < np; j++) cacheU[j] = u[j];
      }
    };
    // Early bursts damp strongly enough to be safe far from the answer; the
    // bursts in between (and all bursts once progress is slow) scale the
    // residuals up so the library's damping floor (1e-7) becomes negligible and
    // the last steps are essentially Gauss-Newton.
    const polish = quietBursts > 0 || restarts % 2 === 1;
    // Right after a polish burst, one damped iteration is enough to confirm
    // the minimum (it finds nothing lower) or to show that progress continues;
    // in the second case the next robust burst gets the full length again.
    const thisBurst: number = !polish && nextRobustShort ? 1 : burst;
    const gain = polish ? 1e4 : 1;
    const wEff = new Float64Array(n);
    const dataY = new Array<number>(n);
    for (let i = 0; i < n; i++) { wEff[i] = (w ? w[i] : 1) * gain; dataY[i] = obs[i] * wEff[i]; }
    const parameterizedFunction = (u: number[]) => {
      evalAt(u);
      return (i: number) => cachePred[i] * wEff[i];
    };
    const jacobianFunction = (u: number[]) => {
      if (!same(jacU, u)) {
        evalAt(u);
        jac(toParams(u, work), cachePred, cacheCols, false);
        for (let j = 0; j < np; j++) jacU[j] = u[j];
      }
      // The library copies each row straight into its matrix, so one buffer is reused.
      // Non-finite derivatives (overflow far from the answer) become 0 so the
      // step stays defined; the error check then rejects a bad point.
      const row = new Array<number>(np);
      return (i: number) => {
        for (let j = 0; j < np; j++) {
          const v = cacheCols[j][i] * scale[j] * wEff[i];
          row[j] = Number.isFinite(v) ? v : 0;
        }
        return row;
      };
    };
    let run: { parameterValues: number[]; iterations: number };
    try {
      run = levenbergMarquardt({ x: dataX, y: dataY }, parameterizedFunction, {
        initialValues: new Array(np).fill(0),
        damping: polish ? polishDamping : startDamping,
        maxIterations: thisBurst,
        errorTolerance: 0,
        minValues: negInfinite,
        maxValues: infinite,
        jacobianFunction,
      });
    } catch {
      // A numerical failure inside the library (e.g. a singular system): restart
      // from the best point with stronger damping.
      run = { parameterValues: new Array(np).fill(0), iterations: thisBurst };
      startDamping = Math.min(startDamping * 100, 1e6);
    }
    iterations += Math.max(run.iterations, 1);
    restarts++;
    const pNew: Float64Array = toParams(run.parameterValues, new Float64Array(np));
    problem.model(pNew, pred);
    const rssNew = sumSquares(obs, pred, w);
    // The library stops early only on an exact fit or when the error became
    // NaN (a step into overflow). In the second case, damp harder next time
    // and do not read the stop as convergence.
    if (run.iterations < thisBurst && rssNew > 0) {
      if (polish) polishDamping = Math.min(polishDamping * 100, 1e6);
      else startDamping = Math.min(startDamping * 100, 1e6);
      if (rssNew < rss) { p = pNew; rss = rssNew; } else problem.model(p, pred);
      quietBursts = 0;
      continue;
    }
    if (!(rssNew <= rss)) {
      // The burst found nothing better: the start is the minimum to working precision.
      problem.model(p, pred);
      if (polish) { converged = true; break; }
      quietBursts = 1;
      continue;
    }
    let maxRel = 0;
    for (let j = 0; j < np; j++) {
      maxRel = Math.max(maxRel, Math.abs(pNew[j] - p[j]) / Math.max(Math.abs(pNew[j]), typical[j]));
    }
    const drop = (rss - rssNew) / Math.max(rss, Number.MIN_VALUE);
    p = pNew;
    rss = rssNew;
    const quiet = drop <= rssRelTol && maxRel <= paramRelTol;
    // A polish burst makes the next robust burst a one-step check; a check that
    // still improved earns the next robust burst its full length.
    if (polish) nextRobustShort = !shortCheckImproved;
    else { shortCheckImproved = thisBurst === 1 && drop > 0; nextRobustShort = false; }
    // Converged when an undamped (polish) burst makes no real progress, or when
    // a burst finds no lower sum of squares at all (every trial step failed).
    if (quiet && (polish || drop === 0)) { converged = true; break; }
    quietBursts = quiet || drop < 1e-6 ? 1 : 0;
  }

  return finishLeastSquares(problem, p, typical, jac, iterations, restarts, converged);
}

function finishLeastSquares(
  problem: LeastSquaresProblem, p: Float64Array, typical: Float64Array, jac: JacobianFunction,
  iterations: number, restarts: number, converged: boolean,
): LeastSquaresResult {
  const n = problem.observations.length;
  const np = p.length;
  const w = problem.weights;
  const pred = new Float64Array(n);
  problem.model(p, pred);
  const columns = Array.from({ length: np }, () => new Float64Array(n));
  jac(p, pred, columns, true);
  void typical;
  const residuals = Array.from(pred, (v, i) => problem.observations[i] - v);
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (residuals[i] * (w ? w[i] : 1)) ** 2;
  const dof = n - np;
  const s2 = rss / dof;

  // Column-scale the weighted Jacobian so the conditioning reflects the
  // problem rather than the parameter units, then QR it and take the SVD of
  // the small triangle (same singular values as J, far cheaper for long J).
  const colNorm = new Float64Array(np);
  const scaled = Array.from({ length: np }, (_, j) => {
    const c = new Float64Array(n);
    let norm = 0;
    for (let i = 0; i < n; i++) { c[i] = columns[j][i] * (w ? w[i] : 1); norm += c[i] * c[i]; }
    colNorm[j] = Math.sqrt(norm) || 1;
    for (let i = 0; i < n; i++) c[i] /= colNorm[j];
    return c;
  });
  // Stationarity: at a minimum the weighted residual is orthogonal to every
  // Jacobian column. The largest cosine between them must be small, otherwise
  // the search stalled (flat region, saddle) rather than converged.
  const rw = Float64Array.from(residuals, (r, i) => r * (w ? w[i] : 1));
  const rNorm = Math.sqrt(rss);
  let maxCosine = 0;
  for (let j = 0; j < np; j++) {
    let dot = 0;
    for (let i = 0; i < n; i++) dot += scaled[j][i] * rw[i];
    if (rNorm > 0) maxCosine = Math.max(maxCosine, Math.abs(dot) / rNorm);
  }
  // A fit exact to working precision (residuals at the rounding level of the
  // observations) has a noise-only residual direction and counts as stationary.
  let yNorm2 = 0;
  for (let i = 0; i < n; i++) yNorm2 += (problem.observations[i] * (w ? w[i] : 1)) ** 2;
  const stationary = rNorm <= 1e-12 * Math.sqrt(yNorm2) || maxCosine < 1e-4;
  const { inverse, inverseCondition } = inverseNormalFromR(householderQr(scaled));
  const covariance = inverse.map((row, a) => row.map((v, b) => (s2 * v) / (colNorm[a] * colNorm[b])));
  const stdErrors = covariance.map((row, a) => Math.sqrt(row[a]));
  const correlation = covariance.map((row, a) => row.map((c, b) => c / (stdErrors[a] * stdErrors[b])));
  const jacobianRows = Array.from({ length: n }, (_, i) => Array.from({ length: np }, (_, j) => columns[j][i]));
  return {
    params: Array.from(p),
    rss,
    dof,
    residualVariance: s2,
    stdErrors,
    covariance,
    correlation,
    residuals,
    jacobian: jacobianRows,
    iterations,
    restarts,
    converged: converged && stationary,
    maxGradientCosine: maxCosine,
    inverseCondition,
  };
}
