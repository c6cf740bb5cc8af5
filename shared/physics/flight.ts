// Point-mass flight with quadratic drag relative to the air:
//   a = -k |v - w| (v - w) - g y_hat,   k = rho Cd A / (2 m)
// with an optional steady horizontal wind w. State is [x, y, vx, vy] in m and m/s.
import { STANDARD_GRAVITY_MPS2 } from './constants';
import { Dp45Workspace, integrateDp45, type Derivative, type Dp45Options, type Dp45Sampler } from './dp45';

export interface FlightModel {
  /** Drag constant k = rho Cd A / (2 m), per metre. Zero gives vacuum flight. */
  dragK_perM: number;
  /** Local gravity; defaults to standard gravity 9.80665 m/s^2. */
  gravityMps2?: number;
  /** Steady horizontal wind (positive along +x). */
  windXMps?: number;
}

export interface LaunchState {
  xM: number;
  yM: number;
  vxMps: number;
  vyMps: number;
}

/** Default integration tolerances: far below any marking error (mm) over shots of seconds. */
export const DEFAULT_TOLERANCES: Pick<Dp45Options, 'rtol' | 'atol'> = { rtol: 1e-10, atol: 1e-10 };

/** k from drag coefficient, diameter, mass and air density (sphere-like frontal area pi d^2 / 4). */
export function dragKFromCd(dragCoefficient: number, diameterM: number, massKg: number, airDensityKgM3: number): number {
  const areaM2 = (Math.PI * diameterM * diameterM) / 4;
  return (airDensityKgM3 * dragCoefficient * areaM2) / (2 * massKg);
}

/** Cd = 2 m k / (rho A): the inverse of dragKFromCd. */
export function cdFromDragK(dragK_perM: number, diameterM: number, massKg: number, airDensityKgM3: number): number {
  const areaM2 = (Math.PI * diameterM * diameterM) / 4;
  return (2 * massKg * dragK_perM) / (airDensityKgM3 * areaM2);
}

/** Packs the model as [k, g, wind x] for flightRhs. */
export function flightConstants(model: FlightModel): Float64Array {
  return Float64Array.of(model.dragK_perM, model.gravityMps2 ?? STANDARD_GRAVITY_MPS2, model.windXMps ?? 0);
}

/** Right-hand side of the flight ODE; c = flightConstants(model). */
export const flightRhs: Derivative = (_t, s, d, c) => {
  const rx = s[2] - c[2];
  const ry = s[3];
  const kSpeed = c[0] * Math.sqrt(rx * rx + ry * ry);
  d[0] = s[2];
  d[1] = s[3];
  d[2] = -kSpeed * rx;
  d[3] = -kSpeed * ry - c[1];
};

/** The flight ODE as a self-contained derivative (constants bound), for one-off integrations. */
export function flightDerivative(model: FlightModel): (t: number, y: Float64Array, dydt: Float64Array) => void {
  const c = flightConstants(model);
  return (t, s, d) => flightRhs(t, s, d, c);
}

export interface TrajectoryPoint {
  tS: number;
  xM: number;
  yM: number;
  vxMps: number;
  vyMps: number;
}

export interface SimulateOptions {
  /** Sample times (s, ascending, from t0 onwards). Defaults to 200 even steps to impact or tMaxS. */
  timesS?: number[];
  /** Stop when y falls to this height (m) on the way down. */
  stopAtHeightM?: number;
  /** Upper time limit (s). */
  tMaxS?: number;
  rtol?: number;
  atol?: number;
}

export interface SimulatedTrajectory {
  points: TrajectoryPoint[];
  /** Time the run ended: ground impact if stopAtHeightM was reached, else tMaxS. */
  endTS: number;
  end: TrajectoryPoint;
  hitStopHeight: boolean;
  acceptedSteps: number;
}

/**
 * Integrate a trajectory from a launch state at t0 = 0. With stopAtHeightM the
 * run ends where the body comes down through that height (event location on
 * the dense output), and the samples are those up to that moment.
 */
export function simulateTrajectory(model: FlightModel, launch: LaunchState, options: SimulateOptions = {}): SimulatedTrajectory {
  const f = flightRhs;
  const c = flightConstants(model);
  const tol = { rtol: options.rtol ?? DEFAULT_TOLERANCES.rtol, atol: options.atol ?? DEFAULT_TOLERANCES.atol };
  const y0 = [launch.xM, launch.yM, launch.vxMps, launch.vyMps];
  const tMax = options.tMaxS ?? 600;
  const stopH = options.stopAtHeightM;
  const event = stopH === undefined
    ? undefined
    : { fn: (_t: number, s: Float64Array) => s[1] - stopH, direction: -1 as const };

  let times = options.timesS;
  let tEndRun = times && times.length > 0 ? times[times.length - 1] : tMax;
  if (!times || times.length === 0) {
    // First find the end, then sample it evenly: two cheap runs keep the API simple.
    const probe = integrateDp45(f, 0, y0, tMax, tol, undefined, event, undefined, c);
    tEndRun = probe.tEnd;
    times = Array.from({ length: 201 }, (_, i) => (tEndRun * i) / 200);
  }
  const out = new Float64Array(times.length * 4);
  // With a stop height the second run repeats the probe's steps and stops at the same event.
  const tRun = event && !options.timesS ? tMax : Math.max(tEndRun, 1e-12);
  const run = integrateDp45(f, 0, y0, tRun, tol, { times, out }, event, undefined, c);
  const points: TrajectoryPoint[] = [];
  for (let i = 0; i < run.samplesFilled; i++) {
    points.push({ tS: times[i], xM: out[4 * i], yM: out[4 * i + 1], vxMps: out[4 * i + 2], vyMps: out[4 * i + 3] });
  }
  const e = run.yEnd;
  return {
    points,
    endTS: run.tEnd,
    end: { tS: run.tEnd, xM: e[0], yM: e[1], vxMps: e[2], vyMps: e[3] },
    hitStopHeight: run.eventFound,
    acceptedSteps: run.acceptedSteps,
  };
}

/**
 * Positions at sorted mark times for the fit: one integration per parameter
 * vector, sampling on the dense output. Writes x into xOut and y into yOut.
 * Returns the accepted step sizes so a caller can replay them (smooth
 * finite-difference Jacobians) by passing replaySteps.
 */
export class PositionSampler {
  private readonly ws = new Dp45Workspace(4);
  private readonly out: Float64Array;
  private readonly y0 = new Float64Array(4);
  private readonly t0: number;
  private readonly tEnd: number;
  private readonly constants = new Float64Array(3);
  private readonly options: Dp45Options;
  private readonly sampler: Dp45Sampler;
  constructor(private readonly timesS: Float64Array, tol = DEFAULT_TOLERANCES) {
    this.out = new Float64Array(timesS.length * 2);
    this.options = { rtol: tol.rtol, atol: tol.atol, replaySteps: undefined, recordSteps: true };
    this.sampler = { times: timesS, out: this.out, components: 2 };
    this.t0 = timesS[0];
    this.tEnd = timesS[timesS.length - 1];
  }

  sample(
    model: FlightModel, launch: LaunchState, xOut: Float64Array, yOut: Float64Array, replaySteps?: ArrayLike<number>,
  ): number[] | undefined {
    this.y0[0] = launch.xM; this.y0[1] = launch.yM; this.y0[2] = launch.vxMps; this.y0[3] = launch.vyMps;
    this.constants[0] = model.dragK_perM;
    this.constants[1] = model.gravityMps2 ?? STANDARD_GRAVITY_MPS2;
    this.constants[2] = model.windXMps ?? 0;
    this.options.replaySteps = replaySteps;
    this.options.recordSteps = replaySteps === undefined;
    const run = integrateDp45(flightRhs, this.t0, this.y0, this.tEnd, this.options, this.sampler, undefined, this.ws, this.constants);
    const n = this.timesS.length;
    for (let i = 0; i < n; i++) {
      xOut[i] = this.out[2 * i];
      yOut[i] = this.out[2 * i + 1];
    }
    return run.recordedSteps;
  }
}
