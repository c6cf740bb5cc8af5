import { describe, expect, it } from 'vitest';
import { mulberry32, normalDeviates } from '../random/prng';
import { fitDragFree } from './drag-free-fit';
import { fitQuadraticDrag } from './drag-fit';
import { dragKFromCd, simulateTrajectory } from './flight';
import { freeGravityCheck } from './free-g-check';
import type { FitMark } from './types';

const G0 = 9.80665;

/** A shot sampled at fps frames per second, with the time stamps read at readFps (a wrong frame rate when they differ). */
function shot(k: number, fps: number, readFps: number, noiseM: number, seed: number, count = 90): FitMark[] {
  const times = Array.from({ length: count }, (_, i) => i / fps);
  const path = simulateTrajectory({ dragK_perM: k, gravityMps2: G0 }, { xM: 0, yM: 1, vxMps: 38, vyMps: 14 }, { timesS: times });
  const gauss = normalDeviates(mulberry32(seed));
  return path.points.map((p, i) => ({ tS: i / readFps, xM: p.xM + noiseM * gauss(), yM: p.yM + noiseM * gauss() }));
}

function check(marks: FitMark[], typicalK: number, scaleRel = 0) {
  const free = fitDragFree(marks, G0);
  const drag = fitQuadraticDrag(marks, { gravityMps2: G0, startState: free.state, typicalK_perM: typicalK });
  const p = drag.fit.params as [number, number, number, number, number];
  return { free, result: freeGravityCheck(marks, { statedGravityMps2: G0, start: p, typicalK_perM: typicalK, scaleRelUncertainty: scaleRel }) };
}

// A tennis-ball-like body: Cd 0.55, 66 mm, 57 g, sea-level air (handbook values from memory).
const K = dragKFromCd(0.55, 0.066, 0.057, 1.225);

describe('free-g check inside the drag model', () => {
  it('noiseless vacuum flight: g comes back exactly (closed form y = y0 + vy t − g t²/2)', () => {
    const { result } = check(shot(0, 240, 240, 0, 1), 0.01);
    expect(result.gravityMps2.value).toBeCloseTo(G0, 6);
    expect(result.caution).toBeNull();
  });

  it('a draggy shot with 1 mm marking noise: the six-parameter g agrees with 9.81; the drag-free parabola does not', () => {
    const { free, result } = check(shot(K, 240, 240, 0.001, 2), K);
    expect(Math.abs(result.deviationSigmas)).toBeLessThan(3);
    expect(result.gravityMps2.value).toBeCloseTo(G0, 1);
    expect(result.caution).toBeNull();
    // What the old figure said on the same clip: drag absorbed into g, more than
    // 3 σ and 2 % away (the old caution's rule), so it would have alarmed.
    const gOld = free.result.freeGravityMps2;
    expect(Math.abs(gOld.value - G0) / gOld.stdErr).toBeGreaterThan(3);
    expect(Math.abs(gOld.value / G0 - 1)).toBeGreaterThan(0.5);
  });

  it('a frame rate read as 250 instead of 240 fps: g scales by (250/240)² and the check cautions', () => {
    const { result } = check(shot(K, 240, 250, 0.002, 3), K);
    // Times shrink by 240/250, so accelerations grow by (250/240)² = 1.085.
    expect(result.gravityMps2.value / G0).toBeCloseTo((250 / 240) ** 2, 1);
    expect(result.caution).toMatch(/check the capture frame rate and the scale/);
  });

  it('a 1 % scale uncertainty keeps a 1 % scale error from raising the caution', () => {
    const marks = shot(K, 240, 240, 0.0005, 4).map((m) => ({ ...m, xM: m.xM * 1.01, yM: m.yM * 1.01 }));
    expect(check(marks, K).result.caution).not.toBeNull();
    expect(check(marks, K, 0.01).result.caution).toBeNull();
  });
});
