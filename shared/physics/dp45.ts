// Dormand-Prince 5(4) explicit Runge-Kutta with adaptive steps, Hairer's
// 4th-order dense output, event location on the dense output and a replay
// mode. Written for small systems (a 4-state flight), so it works on
// preallocated Float64Arrays and allocates nothing per step.
//
// Replay mode re-runs a recorded step sequence without error control. The
// fit differentiates trajectories numerically; with adaptive steps the step
// sequence would jump as parameters change and put noise into the
// derivatives, whereas a fixed sequence makes the output a smooth function of
// the parameters.

/**
 * Right-hand side. constants is passed through unchanged: letting one shared
 * function read its constants (rather than a fresh closure per model) keeps
 * the call site monomorphic, which matters for speed inside fits.
 */
export type Derivative = (t: number, y: Float64Array, dydt: Float64Array, constants: Float64Array) => void;

export interface Dp45Options {
  /** Relative tolerance per component. */
  rtol: number;
  /** Absolute tolerance per component (units of the state). */
  atol: number;
  /** First trial step; chosen automatically when omitted. */
  hInitial?: number;
  maxSteps?: number;
  /** Replay these step sizes exactly (no error control); used for smooth finite differences. */
  replaySteps?: ArrayLike<number>;
  /** Record accepted step sizes in the result so they can be replayed. */
  recordSteps?: boolean;
}

export interface Dp45Sampler {
  /** Output times, sorted ascending, inside [t0, tEnd]. */
  times: ArrayLike<number>;
  /** Receives `components` values per time, row-major. */
  out: Float64Array;
  /** Number of leading state components to sample (default: all). A fit needs only positions. */
  components?: number;
}

export interface Dp45Event {
  /** Event function; the integration stops where it crosses zero. */
  fn: (t: number, y: Float64Array) => number;
  /** +1: only rising crossings, -1: only falling, 0: both. */
  direction: -1 | 0 | 1;
}

export interface Dp45Result {
  tEnd: number;
  yEnd: Float64Array;
  acceptedSteps: number;
  rejectedSteps: number;
  evaluations: number;
  /** True when the event stopped the run (tEnd is then the event time). */
  eventFound: boolean;
  recordedSteps?: number[];
  /** Number of sampler rows filled (rows past the stop point stay untouched). */
  samplesFilled: number;
}

// Dormand & Prince (1980) coefficients, J. Comput. Appl. Math. 6, 19-26.
const NO_CONSTANTS = new Float64Array(0);
const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const A71 = 35 / 384, A73 = 500 / 1113, A74 = 125 / 192, A75 = -2187 / 6784, A76 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;
// Dense-output coefficients from Hairer's DOPRI5 (Hairer, Norsett & Wanner, Solving ODEs I).
const D1 = -12715105075 / 11282082432, D3 = 87487479700 / 32700410799, D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632, D6 = -1453857185 / 822651844, D7 = 69997945 / 29380423;

/** Reusable work arrays so repeated integrations (inside a fit) allocate once. */
export class Dp45Workspace {
  readonly dim: number;
  readonly y: Float64Array; readonly yNew: Float64Array; readonly yStage: Float64Array;
  readonly k1: Float64Array; readonly k2: Float64Array; readonly k3: Float64Array; readonly k4: Float64Array;
  readonly k5: Float64Array; readonly k6: Float64Array; readonly k7: Float64Array;
  readonly r1: Float64Array; readonly r2: Float64Array; readonly r3: Float64Array; readonly r4: Float64Array; readonly r5: Float64Array;
  readonly yDense: Float64Array;
  constructor(dim: number) {
    this.dim = dim;
    const mk = () => new Float64Array(dim);
    this.y = mk(); this.yNew = mk(); this.yStage = mk();
    this.k1 = mk(); this.k2 = mk(); this.k3 = mk(); this.k4 = mk(); this.k5 = mk(); this.k6 = mk(); this.k7 = mk();
    this.r1 = mk(); this.r2 = mk(); this.r3 = mk(); this.r4 = mk(); this.r5 = mk();
    this.yDense = mk();
  }
}

/** Evaluate the dense-output polynomial of the last step at fraction theta into out. */
function dense(ws: Dp45Workspace, theta: number, out: Float64Array, offset: number, components: number): void {
  const t1 = 1 - theta;
  for (let i = 0; i < components; i++) {
    out[offset + i] = ws.r1[i] + theta * (ws.r2[i] + t1 * (ws.r3[i] + theta * (ws.r4[i] + t1 * ws.r5[i])));
  }
}

/**
 * Integrate y' = f(t, y) from t0 to tEnd (tEnd > t0). Optionally samples the
 * solution at sorted times and/or stops at the first zero crossing of an event
 * function (located to near machine precision on the dense output).
 */
export function integrateDp45(
  f: Derivative,
  t0: number,
  y0: ArrayLike<number>,
  tEnd: number,
  options: Dp45Options,
  sampler?: Dp45Sampler,
  event?: Dp45Event,
  workspace?: Dp45Workspace,
  constants: Float64Array = NO_CONSTANTS,
): Dp45Result {
  const dim = y0.length;
  const ws = workspace && workspace.dim === dim ? workspace : new Dp45Workspace(dim);
  const { y, yNew, yStage, k1, k2, k3, k4, k5, k6, k7 } = ws;
  const { rtol, atol } = options;
  const maxSteps = options.maxSteps ?? 100000;
  const replay = options.replaySteps;
  const recorded: number[] | undefined = options.recordSteps ? [] : undefined;
  if (!(tEnd > t0)) throw new RangeError('integrateDp45 needs tEnd > t0');
  for (let i = 0; i < dim; i++) y[i] = y0[i];

  let t = t0;
  let evaluations = 0;
  f(t, y, k1, constants);
  evaluations++;

  let h = options.hInitial ?? initialStep(f, t, y, k1, tEnd - t0, rtol, atol, ws, constants);
  if (replay === undefined) evaluations++;
  let accepted = 0;
  let rejected = 0;
  let sampleIndex = 0;
  const times = sampler?.times;
  const nTimes = times ? times.length : 0;
  const comps = sampler?.components ?? dim;
  // Samples exactly at t0 are taken from the initial state.
  while (times && sampleIndex < nTimes && times[sampleIndex] <= t0) {
    for (let i = 0; i < comps; i++) sampler!.out[sampleIndex * comps + i] = y[i];
    sampleIndex++;
  }
  let gOld = event ? event.fn(t, y) : 0;
  let eventFound = false;
  let lastRejected = false;

  while (t < tEnd) {
    if (accepted + rejected >= maxSteps) throw new Error('integrateDp45: too many steps');
    if (replay !== undefined) {
      if (accepted >= replay.length) break;
      // The last replayed step lands exactly on tEnd so no sample is lost to rounding.
      h = accepted === replay.length - 1 ? tEnd - t : replay[accepted];
    }
    if (t + h >= tEnd || t + 1.01 * h >= tEnd) h = tEnd - t;

    for (let i = 0; i < dim; i++) yStage[i] = y[i] + h * A21 * k1[i];
    f(t + C2 * h, yStage, k2, constants);
    for (let i = 0; i < dim; i++) yStage[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
    f(t + C3 * h, yStage, k3, constants);
    for (let i = 0; i < dim; i++) yStage[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
    f(t + C4 * h, yStage, k4, constants);
    for (let i = 0; i < dim; i++) yStage[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
    f(t + C5 * h, yStage, k5, constants);
    for (let i = 0; i < dim; i++) {
      yStage[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
    }
    f(t + h, yStage, k6, constants);
    for (let i = 0; i < dim; i++) {
      yNew[i] = y[i] + h * (A71 * k1[i] + A73 * k3[i] + A74 * k4[i] + A75 * k5[i] + A76 * k6[i]);
    }
    f(t + h, yNew, k7, constants);
    evaluations += 6;

    let errNorm = 0;
    if (replay === undefined) {
      for (let i = 0; i < dim; i++) {
        const e = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
        const sc = atol + rtol * Math.max(Math.abs(y[i]), Math.abs(yNew[i]));
        errNorm += (e / sc) * (e / sc);
      }
      errNorm = Math.sqrt(errNorm / dim);
      if (!Number.isFinite(errNorm)) throw new Error('integrateDp45: non-finite state');
      if (errNorm > 1) {
        rejected++;
        // Shrink, but never below a fifth; after a rejection do not grow.
        h *= Math.max(0.2, 0.9 * Math.pow(errNorm, -0.2));
        lastRejected = true;
        continue;
      }
    }

    // Accepted: build the dense-output polynomial for [t, t + h].
    const { r1, r2, r3, r4, r5 } = ws;
    for (let i = 0; i < dim; i++) {
      const yDiff = yNew[i] - y[i];
      const bspl = h * k1[i] - yDiff;
      r1[i] = y[i];
      r2[i] = yDiff;
      r3[i] = bspl;
      r4[i] = yDiff - h * k7[i] - bspl;
      r5[i] = h * (D1 * k1[i] + D3 * k3[i] + D4 * k4[i] + D5 * k5[i] + D6 * k6[i] + D7 * k7[i]);
    }
    const tNew = t + h;
    accepted++;
    recorded?.push(h);

    let tStop = tNew;
    if (event) {
      const gNew = event.fn(tNew, yNew);
      const crossed =
        (event.direction >= 0 && gOld < 0 && gNew >= 0) || (event.direction <= 0 && gOld > 0 && gNew <= 0);
      if (crossed) {
        tStop = locateEvent(ws, event, t, h, gOld, gNew);
        eventFound = true;
      }
      gOld = gNew;
    }

    if (times) {
      while (sampleIndex < nTimes && times[sampleIndex] <= tStop) {
        dense(ws, (times[sampleIndex] - t) / h, sampler!.out, sampleIndex * comps, comps);
        sampleIndex++;
      }
    }

    if (eventFound) {
      dense(ws, (tStop - t) / h, ws.yDense, 0, dim);
      for (let i = 0; i < dim; i++) y[i] = ws.yDense[i];
      t = tStop;
      break;
    }

    for (let i = 0; i < dim; i++) {
      y[i] = yNew[i];
      k1[i] = k7[i]; // FSAL: last stage is the first stage of the next step
    }
    t = tNew;
    if (replay === undefined) {
      const grow = errNorm === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(errNorm, -0.2)));
      h *= lastRejected ? Math.min(1, grow) : grow;
      lastRejected = false;
    }
  }

  return {
    tEnd: t,
    yEnd: Float64Array.from(y),
    acceptedSteps: accepted,
    rejectedSteps: rejected,
    evaluations,
    eventFound,
    recordedSteps: recorded,
    samplesFilled: sampleIndex,
  };
}

/** Illinois-modified regula falsi on the dense output; converges to ~1e-15 of the step. */
function locateEvent(ws: Dp45Workspace, event: Dp45Event, t: number, h: number, gA: number, gB: number): number {
  let a = 0, b = 1, fa = gA, fb = gB;
  let side = 0;
  for (let iter = 0; iter < 100; iter++) {
    const c = (a * fb - b * fa) / (fb - fa);
    dense(ws, c, ws.yDense, 0, ws.dim);
    const fc = event.fn(t + c * h, ws.yDense);
    if (fc === 0 || Math.abs(b - a) < 1e-15) return t + c * h;
    if ((fc > 0) === (fb > 0)) {
      b = c; fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c; fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
    if (Math.abs(b - a) < 1e-15) break;
  }
  return t + ((a + b) / 2) * h;
}

/** Starting step after Hairer, Norsett & Wanner (Solving ODEs I, II.4): balance the first two Taylor terms. */
function initialStep(
  f: Derivative, t: number, y: Float64Array, f0: Float64Array, span: number,
  rtol: number, atol: number, ws: Dp45Workspace, constants: Float64Array,
): number {
  const dim = ws.dim;
  let d0 = 0, d1 = 0;
  for (let i = 0; i < dim; i++) {
    const sc = atol + rtol * Math.abs(y[i]);
    d0 += (y[i] / sc) ** 2;
    d1 += (f0[i] / sc) ** 2;
  }
  d0 = Math.sqrt(d0 / dim);
  d1 = Math.sqrt(d1 / dim);
  let h0 = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 : 0.01 * (d0 / d1);
  h0 = Math.min(h0, span);
  for (let i = 0; i < dim; i++) ws.yStage[i] = y[i] + h0 * f0[i];
  f(t + h0, ws.yStage, ws.k2, constants);
  let d2 = 0;
  for (let i = 0; i < dim; i++) {
    const sc = atol + rtol * Math.abs(y[i]);
    d2 += ((ws.k2[i] - f0[i]) / sc) ** 2;
  }
  d2 = Math.sqrt(d2 / dim) / h0;
  const dMax = Math.max(d1, d2);
  const h1 = dMax <= 1e-15 ? Math.max(1e-6, h0 * 1e-3) : Math.pow(0.01 / dMax, 1 / 5);
  return Math.min(100 * h0, h1, span);
}
