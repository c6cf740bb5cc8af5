import { describe, expect, it } from 'vitest';
import { fitDragFree } from './drag-free-fit';
import { mulberry32, normalDeviates } from '../random/prng';

const G = 9.80665;

function parabola(n: number, fps: number, g = G) {
  // x = 0.3 + 12 t, y = 1.1 + 9 t - g t^2 / 2 (closed form of vacuum flight)
  return Array.from({ length: n }, (_, i) => {
    const t = 0.2 + i / fps;
    const tau = t - 0.2;
    return { tS: t, xM: 0.3 + 12 * tau, yM: 1.1 + 9 * tau - 0.5 * g * tau * tau };
  });
}

describe('drag-free fit', () => {
  it('recovers an exact parabola exactly', () => {
    const r = fitDragFree(parabola(50, 240));
    expect(r.state[0]).toBeCloseTo(0.3, 11);
    expect(r.state[1]).toBeCloseTo(1.1, 11);
    expect(r.state[2]).toBeCloseTo(12, 10);
    expect(r.state[3]).toBeCloseTo(9, 10);
    expect(r.result.launchSpeedMps.value).toBeCloseTo(15, 10);
    expect(r.result.launchAngleDeg.value).toBeCloseTo((Math.atan2(9, 12) * 180) / Math.PI, 9);
    expect(r.result.rmsResidualM).toBeLessThan(1e-12);
  });

  it('free-g variant recovers 9.80665 on clean data, and a wrong local g on data made with it', () => {
    expect(fitDragFree(parabola(60, 500)).result.freeGravityMps2.value).toBeCloseTo(9.80665, 9);
    expect(fitDragFree(parabola(60, 500, 9.78)).result.freeGravityMps2.value).toBeCloseTo(9.78, 9);
  });

  it('noisy data: intervals contain the truth and standard errors scale like the noise', () => {
    const noise = normalDeviates(mulberry32(42));
    const marks = parabola(120, 240).map((m) => ({ ...m, xM: m.xM + 0.002 * noise(), yM: m.yM + 0.002 * noise() }));
    const r = fitDragFree(marks).result;
    expect(r.launchSpeedMps.ci95[0]).toBeLessThan(15);
    expect(r.launchSpeedMps.ci95[1]).toBeGreaterThan(15);
    expect(r.rmsResidualM).toBeGreaterThan(0.0015);
    expect(r.rmsResidualM).toBeLessThan(0.0025);
    const g = r.freeGravityMps2;
    expect(g.ci95[0]).toBeLessThan(G);
    expect(g.ci95[1]).toBeGreaterThan(G);
    const noisier = parabola(120, 240).map((m) => ({ ...m, xM: m.xM + 0.02 * noise(), yM: m.yM + 0.02 * noise() }));
    const ratio = fitDragFree(noisier).result.launchSpeedMps.stdErr / r.launchSpeedMps.stdErr;
    expect(ratio).toBeGreaterThan(7);
    expect(ratio).toBeLessThan(13);
  });
});
