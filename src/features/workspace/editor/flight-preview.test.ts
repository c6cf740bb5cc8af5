import { describe, expect, it } from 'vitest';
import { simulateTrajectory } from '@shared/physics/flight';
import { flightPreview } from './flight-preview';

// Checks against closed forms: vacuum flight x = x0 + vx t, y = y0 + vy t - g t^2 / 2
// (any mechanics text, e.g. Halliday & Resnick ch. 4), g = 9.80665 m/s^2 (CGPM 1901 standard gravity).
const G = 9.80665;
const dt = 1 / 240;

describe('flight preview', () => {
  it('needs five marks', () => {
    const marks = [0, 1, 2, 3].map((i) => ({ tS: i * dt, xM: i, yM: 0 }));
    expect(flightPreview(marks, 4 * dt)).toBeNull();
  });

  it('predicts the next frame of a vacuum parabola exactly', () => {
    const vx = 20, vy = 12;
    const at = (t: number) => ({ tS: t, xM: 0.1 + vx * t, yM: 1.2 + vy * t - 0.5 * G * t * t });
    const marks = Array.from({ length: 8 }, (_, i) => at(i * dt));
    const p = flightPreview(marks, 8 * dt)!;
    const expected = at(8 * dt);
    expect(p.dragFree.next!.xM).toBeCloseTo(expected.xM, 9);
    expect(p.dragFree.next!.yM).toBeCloseTo(expected.yM, 9);
    // Drag-free data: the drag fit should find no drag to speak of.
    expect(Math.abs(p.drag!.dragK_perM)).toBeLessThan(1e-3);
  });

  it('keeps both curves when the last mark is on the clip’s last frame (no next frame to predict)', () => {
    const k = 0.05;
    const times = Array.from({ length: 40 }, (_, i) => i * dt * 3);
    const run = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 0, vxMps: 30, vyMps: 20 }, { timesS: times });
    const marks = run.points.map((q) => ({ tS: q.tS, xM: q.xM, yM: q.yM }));
    const p = flightPreview(marks, null)!;
    expect(p).not.toBeNull();
    // The drag fit converged and says so: it is not reported as missing.
    expect(p.drag!.dragK_perM).toBeCloseTo(k, 4);
    expect(p.drag!.next).toBeNull();
    expect(p.dragFree.next).toBeNull();
    // The drawn curves reach the last mark and every point is a number.
    expect(p.drag!.path.at(-1)!.tS).toBeCloseTo(marks.at(-1)!.tS, 12);
    for (const q of [...p.drag!.path, ...p.dragFree.path]) expect(Number.isFinite(q.xM) && Number.isFinite(q.yM)).toBe(true);
  });

  it('follows marks from a drag flight with the drag curve, and the vacuum curve misses', () => {
    const k = 0.05;
    const times = Array.from({ length: 40 }, (_, i) => i * dt * 3);
    const run = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 0, vxMps: 30, vyMps: 20 }, { timesS: [...times, 40 * dt * 3] });
    const marks = run.points.slice(0, 40).map((q) => ({ tS: q.tS, xM: q.xM, yM: q.yM }));
    const truthNext = run.points[40];
    const p = flightPreview(marks, truthNext.tS)!;
    expect(p.drag!.dragK_perM).toBeCloseTo(k, 4);
    expect(Math.hypot(p.drag!.next!.xM - truthNext.xM, p.drag!.next!.yM - truthNext.yM)).toBeLessThan(1e-5);
    expect(Math.hypot(p.dragFree.next!.xM - truthNext.xM, p.dragFree.next!.yM - truthNext.yM)).toBeGreaterThan(1e-3);
  });
});
