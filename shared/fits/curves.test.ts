import { describe, expect, it } from 'vitest';
import type { FitShotResult } from '../physics/types';
import { dragFreePathAt, finiteDifferenceSpeeds } from './curves';

describe('plot curves', () => {
  it('the drag-free path is the closed-form parabola', () => {
    const e = (value: number) => ({ value, stdErr: 0, ci95: [value, value] as [number, number] });
    const result = { tRefS: 0.5, dragFree: { x0M: e(1), y0M: e(2), launchSpeedMps: e(20), launchAngleDeg: e(30) } } as unknown as FitShotResult;
    const [p] = dragFreePathAt(result, [1.5], 9.80665);
    // x = x0 + v cos θ τ, y = y0 + v sin θ τ − g τ²/2 with τ = 1 s.
    expect(p.xM).toBeCloseTo(1 + 20 * Math.cos(Math.PI / 6), 12);
    expect(p.yM).toBeCloseTo(2 + 10 - 9.80665 / 2, 12);
    expect(p.speedMps).toBeCloseTo(Math.hypot(20 * Math.cos(Math.PI / 6), 10 - 9.80665), 12);
  });

  it('finite-difference speeds of a uniform motion are exact', () => {
    const marks = Array.from({ length: 40 }, (_, i) => ({ tS: i / 100, xM: 3 * (i / 100), yM: 4 * (i / 100) }));
    const speeds = finiteDifferenceSpeeds(marks);
    expect(speeds.length).toBe(38); // stride 2 for 40 marks
    for (const s of speeds) expect(s.speedMps).toBeCloseTo(5, 12); // 3-4-5 triangle
  });
});
