import { describe, expect, it } from 'vitest';
import { predictAt, quadraticScatterPx, type TrackPoint } from './motion-model';

// Closed forms: a least-squares quadratic through points of an exact quadratic
// reproduces it, so its prediction is the curve's value and slope exactly.
const parabola = (n: number): TrackPoint => ({ frameNumber: n, u: 40 + 6.2 * n - 0.01 * n * n, v: 300 - 3.5 * n + 0.02 * n * n });

describe('predictAt', () => {
  it('predicts the next frame of an exact parabola exactly, with its velocity', () => {
    const pts = Array.from({ length: 12 }, (_, i) => parabola(10 + i));
    const p = predictAt(pts, 22);
    expect(p.degree).toBe(2);
    expect(p.u).toBeCloseTo(parabola(22).u, 9);
    expect(p.v).toBeCloseTo(parabola(22).v, 9);
    expect(p.du).toBeCloseTo(6.2 - 0.02 * 22, 9);
    expect(p.dv).toBeCloseTo(-3.5 + 0.04 * 22, 9);
  });

  it('predicts backward as well as forward', () => {
    const pts = Array.from({ length: 8 }, (_, i) => parabola(30 + i));
    expect(predictAt(pts, 29).u).toBeCloseTo(parabola(29).u, 9);
  });

  it('starts with a wide gate on two points and narrows it as the track grows', () => {
    const two = predictAt([parabola(0), parabola(1)], 2);
    const twelve = predictAt(Array.from({ length: 12 }, (_, i) => parabola(i)), 12);
    expect(two.degree).toBe(1);
    expect(twelve.gatePx).toBeLessThan(two.gatePx);
    // Frames skipped (hidden) widen it again.
    expect(predictAt(Array.from({ length: 12 }, (_, i) => parabola(i)), 16).gatePx).toBeGreaterThan(twelve.gatePx);
  });

  it('measures no scatter on a clean parabola and some on a zig-zag', () => {
    const clean = Array.from({ length: 6 }, (_, i) => parabola(i));
    expect(quadraticScatterPx(clean)).toBeLessThan(1e-9);
    const zigzag = clean.map((p, i) => ({ ...p, v: p.v + (i % 2 ? 2 : -2) }));
    expect(quadraticScatterPx(zigzag)).toBeGreaterThan(1);
  });
});
