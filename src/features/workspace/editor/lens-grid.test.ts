import { describe, expect, it } from 'vitest';
import { lensModelForFrame, undistort } from '@shared/geometry/lens-distortion';
import { lensGridLines } from './lens-grid';

// Full-HD frame; k1 = −0.14 on the half-diagonal radius is the wide action-camera
// barrel of issue 12 (the plain radius of Brown–Conrady, not its division model).
const frame = { width: 1920, height: 1080 };
const barrel = lensModelForFrame(frame.width, frame.height, { k1: -0.14, k2: 0.02 });
const R = barrel.normRadiusPx;
const { u: cu, v: cv } = barrel.centre;

describe('corrected grid', () => {
  it('without distortion is the plain square grid through the centre, edge to edge', () => {
    const ideal = lensModelForFrame(frame.width, frame.height, { k1: 0, k2: 0 });
    const lines = lensGridLines(ideal, frame, { rows: 8 });
    const vertical = lines.filter((l) => l.family === 'vertical');
    const horizontal = lines.filter((l) => l.family === 'horizontal');
    // Spacing 1080/8 = 135 px from the centre (960, 540): u = 15, 150, …, 1905 and v = 0, 135, …, 1080.
    expect(vertical.map((l) => l.points[0].u)).toEqual(Array.from({ length: 15 }, (_, i) => 15 + 135 * i));
    expect(horizontal.map((l) => l.points[0].v)).toEqual(Array.from({ length: 9 }, (_, i) => 135 * i));
    for (const l of vertical) expect(new Set(l.points.map((p) => p.u)).size).toBe(1);
    expect(vertical[0].points[0].v).toBe(0);
    expect(vertical[0].points.at(-1)!.v).toBe(1080);
  });

  it('draws each grid line where the Brown–Conrady closed form puts it', () => {
    // Brown (1966), as in OpenCV's camera model docs: an ideal point at normalised
    // (x, y), r² = x² + y², shows at (x, y)(1 + k1 r² + k2 r⁴), on the same ray. For a
    // horizontal ideal line y = d/R that fixes x = x_d · y / y_d, so every drawn point
    // must satisfy y_d = y (1 + k1 r² + k2 r⁴): checked without the Newton solver.
    const lines = lensGridLines(barrel, frame).filter((l) => l.family === 'horizontal' && l.idealOffsetPx !== 0);
    expect(lines.length).toBeGreaterThan(4);
    for (const l of lines) {
      const y = l.idealOffsetPx / R;
      for (const p of l.points) {
        const xd = (p.u - cu) / R, yd = (p.v - cv) / R;
        const x = (xd * y) / yd;
        const r2 = x * x + y * y;
        expect(yd).toBeCloseTo(y * (1 + barrel.k1 * r2 + barrel.k2 * r2 * r2), 12);
      }
    }
  });

  it('straightens again under the shared undistortion: every point lies back on its ideal line', () => {
    for (const l of lensGridLines(barrel, frame)) {
      for (const p of l.points) {
        const q = undistort(barrel, p);
        if (l.family === 'vertical') expect(q.u - cu).toBeCloseTo(l.idealOffsetPx, 6);
        else expect(q.v - cv).toBeCloseTo(l.idealOffsetPx, 6);
      }
    }
  });

  it('keeps the middle cross straight and bows the others towards the centre for a barrel lens', () => {
    const lines = lensGridLines(barrel, frame);
    const middle = lines.find((l) => l.family === 'horizontal' && l.idealOffsetPx === 0)!;
    for (const p of middle.points) expect(p.v).toBe(cv);
    const top = lines.filter((l) => l.family === 'horizontal' && l.idealOffsetPx < 0).sort((a, b) => a.idealOffsetPx - b.idealOffsetPx)[0];
    const nearestMiddle = top.points.reduce((a, b) => (Math.abs(b.u - cu) < Math.abs(a.u - cu) ? b : a));
    const end = top.points[0];
    // Barrel (k1 < 0): the far ends are pulled in more than the middle, so they sit nearer the centre line.
    expect(Math.abs(end.v - cv)).toBeLessThan(Math.abs(nearestMiddle.v - cv) - 10);
  });

  it('covers the frame: under a barrel lens the grid still reaches every side, and never leaves the frame', () => {
    const points = lensGridLines(barrel, frame, { samples: 200 }).flatMap((l) => l.points);
    const us = points.map((p) => p.u), vs = points.map((p) => p.v);
    expect(Math.min(...us)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...us)).toBeLessThanOrEqual(frame.width);
    expect(Math.min(...vs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...vs)).toBeLessThanOrEqual(frame.height);
    expect(Math.min(...us)).toBeLessThan(20);
    expect(Math.max(...us)).toBeGreaterThan(frame.width - 20);
    expect(Math.min(...vs)).toBeLessThan(20);
    expect(Math.max(...vs)).toBeGreaterThan(frame.height - 20);
  });
});
