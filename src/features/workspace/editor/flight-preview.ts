// Live preview while marking: once five marks exist, fit both models from the
// physics core to the marks so far and draw them on the frame, with where the
// projectile should be on the next frame. A preview only: the real fit (with
// the projectile's mass, size and air) is run and reviewed elsewhere.
import { DRAG_PARAM, fitQuadraticDrag, launchFromParams } from '@shared/physics/drag-fit';
import { fitDragFree } from '@shared/physics/drag-free-fit';
import { simulateTrajectory } from '@shared/physics/flight';
import { STANDARD_GRAVITY_MPS2 } from '@shared/physics/constants';
import type { FitMark } from '@shared/physics/types';

export const PREVIEW_MIN_MARKS = 5;

/**
 * A plausible drag constant k (1/m) to scale the drag fit's steps: about a
 * tennis-ball-sized body (Cd 0.5, 67 mm, 58 g) in sea-level air gives ~0.01 /m
 * (from memory; it only sets step sizes, not the answer).
 */
const TYPICAL_K_PER_M = 0.01;

export interface WorldPathPoint {
  tS: number;
  xM: number;
  yM: number;
}

export interface FlightPreview {
  dragFree: { path: WorldPathPoint[]; next: WorldPathPoint };
  /** Null when the drag fit did not converge (too few or too noisy marks). */
  drag: { path: WorldPathPoint[]; next: WorldPathPoint; dragK_perM: number } | null;
}

/** `marks` sorted by time; `nextTS` the time of the frame after the last mark. */
export function flightPreview(marks: FitMark[], nextTS: number, samples = 48): FlightPreview | null {
  if (marks.length < PREVIEW_MIN_MARKS) return null;
  const t0 = marks[0].tS;
  const tEnd = Math.max(nextTS, marks[marks.length - 1].tS);
  const taus = Array.from({ length: samples + 1 }, (_, i) => ((tEnd - t0) * i) / samples);

  const free = fitDragFree(marks, STANDARD_GRAVITY_MPS2, t0);
  const [x0, y0, vx, vy] = free.state;
  const vacuumAt = (tau: number): WorldPathPoint => ({
    tS: t0 + tau,
    xM: x0 + vx * tau,
    yM: y0 + vy * tau - 0.5 * STANDARD_GRAVITY_MPS2 * tau * tau,
  });
  const dragFree = { path: taus.map(vacuumAt), next: vacuumAt(nextTS - t0) };

  let drag: FlightPreview['drag'] = null;
  try {
    const fit = fitQuadraticDrag(marks, { startState: free.state, typicalK_perM: TYPICAL_K_PER_M });
    if (fit.fit.converged && fit.fit.params.every(Number.isFinite)) {
      const p = fit.fit.params;
      const run = simulateTrajectory({ dragK_perM: p[DRAG_PARAM.dragK_perM] }, launchFromParams(p), { timesS: [...taus, nextTS - t0].filter((t, i, a) => i === 0 || t > a[i - 1]) });
      const points = run.points.map((q) => ({ tS: t0 + q.tS, xM: q.xM, yM: q.yM }));
      const nextPoint = points.find((q) => Math.abs(q.tS - nextTS) < 1e-12) ?? points[points.length - 1];
      drag = { path: points.filter((q) => q.tS <= tEnd + 1e-12), next: nextPoint, dragK_perM: p[4] };
    }
  } catch {
    drag = null; // a preview that cannot be fitted simply is not drawn
  }
  return { dragFree, drag };
}
