// Drag-free fits: a parabola is linear in its parameters, so these are exact
// linear least-squares problems. With g fixed the fit gives the start for the
// drag fit and the "no drag" model for the verdict; with g free it checks the
// time base and the scale (a wrong frame rate or scale shows up as a wrong g).
import { STANDARD_GRAVITY_MPS2 } from './constants';
import { estimate, RAD_TO_DEG } from './estimate';
import { aicGaussian, bicGaussian } from './information-criteria';
import { linearLeastSquares } from './linear-least-squares';
import type { DragFreeFit, Estimate, FitMark } from './types';

export interface DragFreeDetail {
  result: DragFreeFit;
  /** Launch state at tRef, g fixed, in flight-state order [x0, y0, vx, vy] (the drag fit's start). */
  state: [number, number, number, number];
  rss: number;
  residualsX: number[];
  residualsY: number[];
}

/** Speed and angle (with standard errors by the delta method) from a velocity and its 2x2 covariance. */
export function speedAndAngle(vx: number, vy: number, cov: number[][]): { speed: number; speedSe: number; angle: number; angleSe: number } {
  const speed = Math.hypot(vx, vy);
  const gs = [vx / speed, vy / speed];
  const ga = [-vy / (speed * speed), vx / (speed * speed)];
  const q = (g: number[]) => g[0] * g[0] * cov[0][0] + 2 * g[0] * g[1] * cov[0][1] + g[1] * g[1] * cov[1][1];
  return { speed, speedSe: Math.sqrt(q(gs)), angle: Math.atan2(vy, vx), angleSe: Math.sqrt(q(ga)) };
}

function weightsOf(marks: FitMark[]): number[] | undefined {
  if (!marks.some((m) => m.sigmaM !== undefined)) return undefined;
  const w = marks.map((m) => 1 / (m.sigmaM as number));
  return [...w, ...w];
}

/**
 * Joint fit of x(t) = x0 + vx tau and y(t) = y0 + vy tau - g tau^2 / 2,
 * tau = t - tRef, over all marks, with one pooled residual variance.
 */
export function fitDragFree(marks: FitMark[], gravityMps2 = STANDARD_GRAVITY_MPS2, tRefS = marks[0].tS): DragFreeDetail {
  const n = marks.length;
  const w = weightsOf(marks);
  // Design-matrix columns (not a state vector): x0, vx on the x rows, y0, vy on
  // the y rows. Reordering them changes the solver's rounding, and with it the
  // last bits of every fit that starts from here, so they stay in this order.
  const COL = { x0: 0, vx: 1, y0: 2, vy: 3 } as const;
  const design: number[][] = [];
  const b: number[] = [];
  for (const m of marks) { design.push([1, m.tS - tRefS, 0, 0]); b.push(m.xM); }
  for (const m of marks) {
    const tau = m.tS - tRefS;
    design.push([0, 0, 1, tau]);
    b.push(m.yM + 0.5 * gravityMps2 * tau * tau);
  }
  const fit = linearLeastSquares(design, b, w);
  const p = fit.params;
  const [x0, vx, y0, vy] = [p[COL.x0], p[COL.vx], p[COL.y0], p[COL.vy]];
  const c = fit.covariance;
  const sa = speedAndAngle(vx, vy, [[c[COL.vx][COL.vx], c[COL.vx][COL.vy]], [c[COL.vy][COL.vx], c[COL.vy][COL.vy]]]);

  // Free-g variant: one more column, -tau^2/2 on the y rows.
  const designG = design.map((row, i) => [...row, i < n ? 0 : -0.5 * (marks[i - n].tS - tRefS) ** 2]);
  const bG = [...marks.map((m) => m.xM), ...marks.map((m) => m.yM)];
  const fitG = linearLeastSquares(designG, bG, w);

  const dof = fit.dof;
  const se = (i: number) => Math.sqrt(c[i][i]);
  const G = 4; // the free-g column
  const gEst: Estimate = estimate(fitG.params[G], Math.sqrt(fitG.covariance[G][G]), fitG.dof);
  const rmsResidualM = Math.sqrt(fit.residuals.reduce((a, r) => a + r * r, 0) / fit.residuals.length);
  return {
    result: {
      x0M: estimate(x0, se(COL.x0), dof),
      y0M: estimate(y0, se(COL.y0), dof),
      launchSpeedMps: estimate(sa.speed, sa.speedSe, dof),
      launchAngleDeg: estimate(sa.angle * RAD_TO_DEG, sa.angleSe * RAD_TO_DEG, dof),
      rmsResidualM,
      freeGravityMps2: gEst,
      aic: aicGaussian(fit.rss, 2 * n, 4),
      bic: bicGaussian(fit.rss, 2 * n, 4),
    },
    state: [x0, y0, vx, vy],
    rss: fit.rss,
    residualsX: fit.residuals.slice(0, n),
    residualsY: fit.residuals.slice(n),
  };
}
