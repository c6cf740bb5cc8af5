// Curves drawn from a stored fit: the fitted paths, speeds, and the marks'
// finite-difference speeds. Shared so the result page and the PDF report plot
// the very same numbers.
import { STANDARD_GRAVITY_MPS2 } from '../physics/constants';
import { simulateTrajectory } from '../physics/flight';
import type { FitShotResult, FitMark } from '../physics/types';

export interface CurvePoint {
  tS: number;
  xM: number;
  yM: number;
  speedMps: number;
}

const DEG = Math.PI / 180;

function evenTimes(t0: number, t1: number, count: number): number[] {
  if (!(t1 > t0)) return [t0];
  return Array.from({ length: count }, (_, i) => t0 + ((t1 - t0) * i) / (count - 1));
}

/**
 * The path of the model the headline numbers come from, from the fitted launch
 * state at tRef, sampled at absolute times (not before tRef). When drag is not
 * resolved the headline launch state is the drag-free one, so k is taken as 0
 * there: pairing that state with the unresolved k would draw a path nobody fitted.
 */
export function dragPathAt(result: FitShotResult, timesS: number[], gravityMps2 = STANDARD_GRAVITY_MPS2): CurvePoint[] {
  if (timesS.length === 0) return [];
  const speed = result.launchSpeedMps.value;
  const angle = result.launchAngleDeg.value * DEG;
  const k = result.dragResolved ? result.dragK_perM.value : 0;
  const rel = timesS.map((t) => t - result.tRefS);
  const traj = simulateTrajectory(
    { dragK_perM: k, gravityMps2 },
    { xM: result.x0M.value, yM: result.y0M.value, vxMps: speed * Math.cos(angle), vyMps: speed * Math.sin(angle) },
    { timesS: rel },
  );
  return traj.points.map((p) => ({ tS: p.tS + result.tRefS, xM: p.xM, yM: p.yM, speedMps: Math.hypot(p.vxMps, p.vyMps) }));
}

/** The drag-free parabola of the fit, at absolute times. */
export function dragFreePathAt(result: FitShotResult, timesS: number[], gravityMps2 = STANDARD_GRAVITY_MPS2): CurvePoint[] {
  const f = result.dragFree;
  const angle = f.launchAngleDeg.value * DEG;
  const vx = f.launchSpeedMps.value * Math.cos(angle);
  const vy = f.launchSpeedMps.value * Math.sin(angle);
  return timesS.map((t) => {
    const tau = t - result.tRefS;
    const vyt = vy - gravityMps2 * tau;
    return { tS: t, xM: f.x0M.value + vx * tau, yM: f.y0M.value + vy * tau - 0.5 * gravityMps2 * tau * tau, speedMps: Math.hypot(vx, vyt) };
  });
}

export interface FitCurves {
  drag: CurvePoint[];
  dragFree: CurvePoint[];
}

/** Both fitted paths, densely sampled over the marked span. */
export function fitCurves(result: FitShotResult, marks: Pick<FitMark, 'tS'>[], gravityMps2?: number, count = 120): FitCurves {
  const t0 = result.tRefS;
  const t1 = marks.length ? Math.max(...marks.map((m) => m.tS)) : t0;
  const times = evenTimes(t0, t1, count);
  return { drag: dragPathAt(result, times, gravityMps2), dragFree: dragFreePathAt(result, times, gravityMps2) };
}

export interface FiniteDifferenceSpeed {
  tS: number;
  speedMps: number;
}

/**
 * Speed between marks `stride` apart, |Δr| / Δt, placed at the midpoint time.
 * Marking scatter divided by one frame interval swamps the signal at high
 * frame rates, so the default stride spans about a twentieth of the track:
 * noise falls with the stride while the curve's shape stays visible.
 */
export function finiteDifferenceSpeeds(marks: FitMark[], stride = Math.max(1, Math.round(marks.length / 20))): FiniteDifferenceSpeed[] {
  const sorted = [...marks].sort((a, b) => a.tS - b.tS);
  const out: FiniteDifferenceSpeed[] = [];
  for (let i = stride; i < sorted.length; i++) {
    const a = sorted[i - stride];
    const b = sorted[i];
    const dt = b.tS - a.tS;
    if (!(dt > 0)) continue;
    out.push({ tS: (a.tS + b.tS) / 2, speedMps: Math.hypot(b.xM - a.xM, b.yM - a.yM) / dt });
  }
  return out;
}

export interface MarkWithFit {
  tS: number;
  xM: number;
  yM: number;
  fittedXM: number;
  fittedYM: number;
  xResidualM: number;
  yResidualM: number;
  outlier: boolean;
}

/** Each mark beside the headline model's position at its time, residual = observed − fitted. */
export function marksWithFit(result: FitShotResult, marks: FitMark[], gravityMps2?: number): MarkWithFit[] {
  const sorted = [...marks].sort((a, b) => a.tS - b.tS);
  const fitted = dragPathAt(result, sorted.map((m) => m.tS), gravityMps2);
  return sorted.map((m, i) => {
    const f = fitted[i];
    const flagged = result.residuals.find((r) => r.tS === m.tS)?.outlier ?? false;
    return {
      tS: m.tS,
      xM: m.xM,
      yM: m.yM,
      fittedXM: f.xM,
      fittedYM: f.yM,
      xResidualM: m.xM - f.xM,
      yResidualM: m.yM - f.yM,
      outlier: flagged,
    };
  });
}
