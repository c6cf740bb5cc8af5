// Forecasts from a launch state: range to level ground or to a target height,
// apex, time of flight, impact speed and angle, and the elevation that
// maximises range with drag, beside the vacuum answers.
import { STANDARD_GRAVITY_MPS2 } from './constants';
import { flightConstants, flightRhs, type FlightModel } from './flight';
import { integrateDp45 } from './dp45';

export interface ForecastInput {
  speedMps: number;
  angleDeg: number;
  dragK_perM: number;
  launchHeightM?: number;
  /** Height of the landing plane; default 0 (level ground). */
  targetHeightM?: number;
  gravityMps2?: number;
  windXMps?: number;
}

export interface ForecastResult {
  /** False when the shot never comes down through the target height (e.g. target above the apex). */
  reachesTarget: boolean;
  rangeM: number | null;
  timeOfFlightS: number | null;
  impactSpeedMps: number | null;
  /** Angle of the velocity below the horizontal at impact, degrees. */
  impactAngleDeg: number | null;
  apexHeightM: number;
  apexXM: number;
  apexTimeS: number;
}

export interface VacuumForecast {
  /** Level ground (launch height = target height): v0^2 sin(2 theta) / g. */
  levelRangeM: number;
  /** Apex height above launch: v0^2 sin^2(theta) / (2 g). */
  apexHeightM: number;
  /** Range to the target height from the launch height (closed form of the parabola). */
  rangeM: number | null;
  timeOfFlightS: number | null;
  /** Best elevation on level ground in vacuum. */
  bestAngleDeg: 45;
}

const DEG = Math.PI / 180;
const TOL = { rtol: 1e-11, atol: 1e-11 };
/** Longest flight considered; beyond this the forecast is not meaningful anyway. */
const MAX_FLIGHT_S = 3600;

function modelOf(input: ForecastInput): FlightModel {
  return { dragK_perM: input.dragK_perM, gravityMps2: input.gravityMps2, windXMps: input.windXMps };
}

function initialState(input: ForecastInput): number[] {
  const th = input.angleDeg * DEG;
  return [0, input.launchHeightM ?? 0, input.speedMps * Math.cos(th), input.speedMps * Math.sin(th)];
}

export function forecastShot(input: ForecastInput): ForecastResult {
  const f = flightRhs;
  const c = flightConstants(modelOf(input));
  const s0 = initialState(input);
  const target = input.targetHeightM ?? 0;
  // Apex: vertical velocity falls through zero. A shot launched level or downward peaks at launch.
  let apexHeightM = s0[1], apexXM = 0, apexTimeS = 0;
  if (s0[3] > 0) {
    const apex = integrateDp45(f, 0, s0, MAX_FLIGHT_S, TOL, undefined, { fn: (_t, s) => s[3], direction: -1 }, undefined, c);
    apexHeightM = apex.yEnd[1]; apexXM = apex.yEnd[0]; apexTimeS = apex.tEnd;
  }
  if (apexHeightM < target) {
    return { reachesTarget: false, rangeM: null, timeOfFlightS: null, impactSpeedMps: null, impactAngleDeg: null, apexHeightM, apexXM, apexTimeS };
  }
  // Impact: height falls through the target plane on the way down.
  const hit = integrateDp45(f, 0, s0, MAX_FLIGHT_S, TOL, undefined, { fn: (_t, s) => s[1] - target, direction: -1 }, undefined, c);
  if (!hit.eventFound) {
    return { reachesTarget: false, rangeM: null, timeOfFlightS: null, impactSpeedMps: null, impactAngleDeg: null, apexHeightM, apexXM, apexTimeS };
  }
  const [x, , vx, vy] = hit.yEnd;
  return {
    reachesTarget: true,
    rangeM: x,
    timeOfFlightS: hit.tEnd,
    impactSpeedMps: Math.hypot(vx, vy),
    impactAngleDeg: Math.atan2(-vy, vx) / DEG,
    apexHeightM, apexXM, apexTimeS,
  };
}

export function vacuumForecast(input: ForecastInput): VacuumForecast {
  const g = input.gravityMps2 ?? STANDARD_GRAVITY_MPS2;
  const th = input.angleDeg * DEG;
  const v = input.speedMps;
  const h = (input.launchHeightM ?? 0) - (input.targetHeightM ?? 0);
  const vy = v * Math.sin(th);
  const disc = vy * vy + 2 * g * h;
  const t = disc >= 0 ? (vy + Math.sqrt(disc)) / g : null;
  return {
    levelRangeM: (v * v * Math.sin(2 * th)) / g,
    apexHeightM: (vy * vy) / (2 * g),
    rangeM: t === null ? null : v * Math.cos(th) * t,
    timeOfFlightS: t,
    bestAngleDeg: 45,
  };
}

export interface BestElevation {
  angleDeg: number;
  rangeM: number;
  rangeAt45DegM: number;
  /** Fractional gain of the best range over the 45-degree range. */
  gainOver45: number;
}

/**
 * Elevation that maximises range with drag, by golden-section search on
 * (0.5 deg, 89.5 deg); range is unimodal in elevation for this model.
 */
export function bestElevationForRange(input: Omit<ForecastInput, 'angleDeg'>, toleranceDeg = 1e-4): BestElevation {
  const range = (deg: number) => forecastShot({ ...input, angleDeg: deg }).rangeM ?? Number.NEGATIVE_INFINITY;
  const phi = (Math.sqrt(5) - 1) / 2;
  let a = 0.5, b = 89.5;
  let c = b - phi * (b - a), d = a + phi * (b - a);
  let fc = range(c), fd = range(d);
  while (b - a > toleranceDeg) {
    if (fc >= fd) { b = d; d = c; fd = fc; c = b - phi * (b - a); fc = range(c); }
    else { a = c; c = d; fc = fd; d = a + phi * (b - a); fd = range(d); }
  }
  const angleDeg = (a + b) / 2;
  const rangeM = range(angleDeg);
  const rangeAt45DegM = range(45);
  return { angleDeg, rangeM, rangeAt45DegM, gainOver45: rangeM / rangeAt45DegM - 1 };
}
