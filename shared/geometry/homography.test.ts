import { describe, expect, it } from 'vitest';
import { applyHomography, invertHomography, normaliseHomography, solveHomography } from './homography';
import { GeometryError } from './points';

// A known projective matrix (h33 = 1); the DLT from its own four point images
// must give it back up to scale (Hartley & Zisserman, Multiple View Geometry, §4.1).
const KNOWN = [1.2, 0.1, 30, 0.05, 0.9, 20, 0.0004, 0.0002, 1];
const SRC = [
  { u: 0, v: 0 },
  { u: 640, v: 0 },
  { u: 640, v: 480 },
  { u: 0, v: 480 },
];

describe('homography by DLT', () => {
  it('recovers a known matrix from four correspondences and maps a fifth point', () => {
    const dst = SRC.map((p) => applyHomography(KNOWN, p));
    const h = solveHomography(SRC, dst);
    for (let i = 0; i < 9; i++) expect(h[i]).toBeCloseTo(KNOWN[i], 9);
    // Fifth point by hand: w = 0.0004·200 + 0.0002·100 + 1 = 1.1;
    // u' = (1.2·200 + 0.1·100 + 30)/1.1 = 280/1.1; v' = (0.05·200 + 0.9·100 + 20)/1.1 = 120/1.1.
    const fifth = applyHomography(h, { u: 200, v: 100 });
    expect(fifth.u).toBeCloseTo(280 / 1.1, 9);
    expect(fifth.v).toBeCloseTo(120 / 1.1, 9);
  });

  it('recovers the matrix even when scaled arbitrarily', () => {
    expect(normaliseHomography(KNOWN.map((x) => x * -3.7))).toEqual(KNOWN.map((x) => expect.closeTo(x, 12)));
  });

  it('inverse maps back within 1e-9', () => {
    const inv = invertHomography(KNOWN);
    for (const p of [{ u: 13.25, v: 400.5 }, { u: 600, v: 2 }, { u: -50, v: 700 }]) {
      const back = applyHomography(inv, applyHomography(KNOWN, p));
      expect(Math.abs(back.u - p.u)).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(back.v - p.v)).toBeLessThanOrEqual(1e-9);
    }
  });

  it('refuses three collinear corners and a crossed order', () => {
    const collinear = [{ u: 0, v: 0 }, { u: 100, v: 0 }, { u: 200, v: 0.01 }, { u: 0, v: 100 }];
    expect(() => solveHomography(collinear, SRC)).toThrow(GeometryError);
    const crossed = [SRC[0], SRC[2], SRC[1], SRC[3]];
    expect(() => solveHomography(crossed, SRC)).toThrow(/cross/);
  });
});
