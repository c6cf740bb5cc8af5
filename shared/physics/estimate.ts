// Building Estimate objects: value, standard uncertainty and a 95 % interval.
import type { Estimate } from './types';
import { studentTQuantile } from './student-t';

// The quantile costs an iterative inversion; fits ask for the same dof many times.
const t975Cache = new Map<number, number>();
export function t975(dof: number): number {
  if (!Number.isFinite(dof)) return 1.959963984540054;
  let t = t975Cache.get(dof);
  if (t === undefined) {
    t = studentTQuantile(0.975, dof);
    if (t975Cache.size > 1000) t975Cache.clear();
    t975Cache.set(dof, t);
  }
  return t;
}

/** Interval value +- t(0.975, dof) * stdErr; dof = Infinity gives the normal 1.96. */
export function estimate(value: number, stdErr: number, dof: number): Estimate {
  const t = t975(dof);
  return { value, stdErr, ci95: [value - t * stdErr, value + t * stdErr] };
}

/**
 * Combine a statistical part (Student t with dof) and independent systematic
 * parts (normal) in quadrature. The half-width is sqrt((t u_stat)^2 + sum (1.96 u_i)^2),
 * so few degrees of freedom widen only the part they apply to.
 */
export function combinedEstimate(value: number, statStdErr: number, dof: number, systematic: number[]): Estimate {
  const t = t975(dof);
  const z = 1.959963984540054;
  let half2 = (t * statStdErr) ** 2;
  let u2 = statStdErr ** 2;
  for (const u of systematic) {
    half2 += (z * u) ** 2;
    u2 += u * u;
  }
  const half = Math.sqrt(half2);
  return { value, stdErr: Math.sqrt(u2), ci95: [value - half, value + half] };
}

export const RAD_TO_DEG = 180 / Math.PI;
