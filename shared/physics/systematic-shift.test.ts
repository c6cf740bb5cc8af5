import { describe, expect, it } from 'vitest';
import { rotateWorldPoints } from '../geometry/roll-uncertainty';
import { mulberry32, normalDeviates } from '../random/prng';
import { fitDragFree } from './drag-free-fit';
import { DRAG_PARAM, fitQuadraticDrag } from './drag-fit';
import { dragKFromCd, simulateTrajectory } from './flight';
import { combineShifts, dragFitShift, dragFreeShift, independentSteps2, rollMarkShift } from './systematic-shift';
import type { FitMark } from './types';

const K = dragKFromCd(0.47, 0.1, 0.25, 1.2);

function marks(seed: number): FitMark[] {
  const times = Array.from({ length: 80 }, (_, i) => i / 240);
  const path = simulateTrajectory({ dragK_perM: K }, { xM: 0.1, yM: 0.2, vxMps: 25, vyMps: 15 }, { timesS: times });
  const g = normalDeviates(mulberry32(seed));
  return path.points.map((p) => ({ tS: p.tS, xM: p.xM + 0.002 * g(), yM: p.yM + 0.002 * g() }));
}

function fitOf(ms: FitMark[]) {
  const free = fitDragFree(ms);
  return { free, drag: fitQuadraticDrag(ms, { startState: free.state, typicalK_perM: K }) };
}

describe('first-order shifts agree with refitting the shifted marks', () => {
  it('drag fit, marks turned by a 0.2° roll error: angle and k move as a full refit says (to 2 %), speed to 1e-6', () => {
    const ms = marks(5);
    const base = fitOf(ms).drag.fit;
    const delta = 0.2 / 57.29577951308232;
    const refit = fitOf(rotateWorldPoints(ms, delta)).drag.fit;
    const lin = dragFitShift(base, ms, rollMarkShift(ms, delta));
    const d = (j: number) => refit.params[j] - base.params[j];
    expect(lin.launchAngleDeg).toBeCloseTo(d(DRAG_PARAM.launchAngleRad) * 57.29577951308232, 3);
    expect(lin.launchAngleDeg / (d(DRAG_PARAM.launchAngleRad) * 57.29577951308232)).toBeCloseTo(1, 1);
    expect(Math.abs(lin.dragK_perM / d(DRAG_PARAM.dragK_perM) - 1)).toBeLessThan(0.02);
    // The speed hardly moves (a turn keeps lengths); what is left agrees to a millionth of the speed.
    expect(Math.abs(lin.launchSpeedMps - d(DRAG_PARAM.launchSpeedMps))).toBeLessThan(1e-6 * base.params[DRAG_PARAM.launchSpeedMps]);
    // Turning the frame turns the launch direction by about the same angle (the drag fit holds gravity "down").
    expect(lin.launchAngleDeg).toBeLessThan(-0.15);
    expect(lin.launchAngleDeg).toBeGreaterThan(-0.25);
  });

  it('drag-free parabola: a uniform shift moves only the start point (closed form), and any shift matches the refit exactly', () => {
    const ms = marks(6);
    const { free } = fitOf(ms);
    const [, , vx, vy] = free.state;
    const uniform = { dxM: ms.map(() => 0.05), dyM: ms.map(() => -0.03) };
    const s = dragFreeShift(ms, ms[0].tS, { vxMps: vx, vyMps: vy }, uniform);
    expect(Math.abs(s.launchSpeedMps)).toBeLessThan(1e-9);
    expect(Math.abs(s.launchAngleDeg)).toBeLessThan(1e-9);
    // A stretch along x grows with time: it moves vx by the stretch rate × x-extent per time.
    const stretch = { dxM: ms.map((m) => 0.001 * m.xM), dyM: ms.map(() => 0) };
    const lin = dragFreeShift(ms, ms[0].tS, { vxMps: vx, vyMps: vy }, stretch);
    const re = fitDragFree(ms.map((m) => ({ ...m, xM: m.xM * 1.001 })));
    expect(lin.launchSpeedMps).toBeCloseTo(re.result.launchSpeedMps.value - free.result.launchSpeedMps.value, 5);
  });

  it('components combine as a root sum of squares', () => {
    const c = combineShifts([
      { launchSpeedMps: 3, launchAngleDeg: 0, dragK_perM: 1 },
      { launchSpeedMps: -4, launchAngleDeg: 2, dragK_perM: 0 },
    ]);
    expect(c).toEqual({ launchSpeedMps: 5, launchAngleDeg: 2, dragK_perM: 1 });
  });
});

describe('independent steps of a 2×2 covariance', () => {
  it('their outer products add back to the covariance (spectral theorem)', () => {
    for (const cov of [
      [[4e-6, -3e-6], [-3e-6, 9e-6]],
      [[1e-4, 0], [0, 4e-6]],
      [[2.5e-5, 2.4e-5], [2.4e-5, 2.5e-5]],
    ] as [[number, number], [number, number]][]) {
      const [a, b] = independentSteps2(cov);
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) expect(a[i] * a[j] + b[i] * b[j]).toBeCloseTo(cov[i][j], 14);
      }
    }
  });
});
