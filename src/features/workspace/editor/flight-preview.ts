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
  /** `next` is null when the last mark is on the clip's last frame: there is no next frame to predict. */
  dragFree: { path: WorldPathPoint[]; next: WorldPathPoint | null };
  /** Null when the drag fit did not converge (too few or too noisy marks). */
  drag: { path: WorldPathPoint[]; next: WorldPathPoint | null; dragK_perM: number } | null;
}

/**
 * `marks` sorted by time; `nextTS` the time of the frame after the last mark, or null when the
 * last mark is on the clip's last frame. The curves are fitted either way: marking the last
 * frame must not make the preview disappear.
 */
export function flightPreview(marks: FitMark[], nextTS: number | null, samples = 48): FlightPreview | null {
  if (marks.length < PREVIEW_MIN_MARKS) return null;
  const t0 = marks[0].tS;
  const tLast = marks[marks.length - 1].tS;
  const hasNext = nextTS !== null && Number.isFinite(nextTS);
  const tEnd = hasNext ? Math.max(nextTS, tLast) : tLast;
  const taus = Array.from({ length: samples + 1 }, (_, i) => ((tEnd - t0) * i) / samples);

  const free = fitDragFree(marks, STANDARD_GRAVITY_MPS2, t0);
  const [x0, y0, vx, vy] = free.state;
  const vacuumAt = (tau: number): WorldPathPoint => ({
    tS: t0 + tau,
    xM: x0 + vx * tau,
    yM: y0 + vy * tau - 0.5 * STANDARD_GRAVITY_MPS2 * tau * tau,
  });
  const dragFree = { path: taus.map(vacuumAt), next: hasNext ? vacuumAt(nextTS - t0) : null };

  let drag: FlightPreview['drag'] = null;
  try {
    const fit = fitQuadraticDrag(marks, { startState: free.state, typicalK_perM: TYPICAL_K_PER_M });
    if (fit.fit.converged && fit.fit.params.every(Number.isFinite)) {
      const p = fit.fit.params;
      const times = hasNext ? [...taus, nextTS - t0] : taus;
      const run = simulateTrajectory({ dragK_perM: p[DRAG_PARAM.dragK_perM] }, launchFromParams(p), { timesS: times.filter((t, i, a) => i === 0 || t > a[i - 1]) });
      const points = run.points.map((q) => ({ tS: t0 + q.tS, xM: q.xM, yM: q.yM }));
      const nextPoint = hasNext ? (points.find((q) => Math.abs(q.tS - nextTS) < 1e-12) ?? points[points.length - 1]) : null;
      drag = { path: points.filter((q) => q.tS <= tEnd + 1e-12), next: nextPoint, dragK_perM: p[4] };
    }
  } catch {
    drag = null; // a preview that cannot be fitted simply is not drawn
  }
  return { dragFree, drag };
}
