// Synthetic marks from a known shot, for round-trip tests and the bench.
import { simulateTrajectory } from '../../shared/physics/flight';
import type { FitMark } from '../../shared/physics/types';
import { mulberry32, normalDeviates } from '../../shared/random/prng';

export interface SyntheticShot {
  speedMps: number;
  angleDeg: number;
  dragK_perM: number;
  frameRateHz: number;
  markCount: number;
  noiseM: number;
  seed: number;
  x0M?: number;
  y0M?: number;
  /** Time of the first mark after launch. */
  firstMarkS?: number;
}

export function syntheticMarks(shot: SyntheticShot): FitMark[] {
  const t0 = shot.firstMarkS ?? 0;
  const times = Array.from({ length: shot.markCount }, (_, i) => t0 + i / shot.frameRateHz);
  const th = (shot.angleDeg * Math.PI) / 180;
  const traj = simulateTrajectory(
    { dragK_perM: shot.dragK_perM },
    { xM: shot.x0M ?? 0, yM: shot.y0M ?? 1, vxMps: shot.speedMps * Math.cos(th), vyMps: shot.speedMps * Math.sin(th) },
    { timesS: t0 > 0 ? [0, ...times] : times, rtol: 1e-12, atol: 1e-12 },
  );
  const pts = t0 > 0 ? traj.points.slice(1) : traj.points;
  const noise = normalDeviates(mulberry32(shot.seed));
  return pts.map((p) => ({ tS: p.tS, xM: p.xM + shot.noiseM * noise(), yM: p.yM + shot.noiseM * noise() }));
}
