import { describe, expect, it } from 'vitest';
import { mulberry32, normalDeviates } from '../random/prng';
import { distort, lensModelForFrame, undistort } from './lens-distortion';
import { fitPlumbLines } from './plumb-line-fit';
import { GeometryError, type PixelPoint } from './points';

const W = 1920;
const H = 1080;

/** Points evenly along the ideal straight segment a→b, as the distorting lens shows them. */
function bentLine(k1: number, k2: number, a: PixelPoint, b: PixelPoint, count: number, noise?: () => number): PixelPoint[] {
  const model = lensModelForFrame(W, H, { k1, k2 });
  return Array.from({ length: count }, (_, i) => {
    const t = i / (count - 1);
    const p = distort(model, { u: a.u + (b.u - a.u) * t, v: a.v + (b.v - a.v) * t });
    return noise ? { u: p.u + noise(), v: p.v + noise() } : p;
  });
}

// A scene of the kind a test day offers: a fence rail low in the frame, a
// building edge high up, two posts at the sides, a taut line across the middle.
function scene(k1: number, k2: number, perLine = 9, noise?: () => number): PixelPoint[][] {
  return [
    bentLine(k1, k2, { u: 60, v: 980 }, { u: 1860, v: 1010 }, perLine, noise),
    bentLine(k1, k2, { u: 80, v: 90 }, { u: 1840, v: 60 }, perLine, noise),
    bentLine(k1, k2, { u: 120, v: 60 }, { u: 150, v: 1030 }, perLine, noise),
    bentLine(k1, k2, { u: 1780, v: 40 }, { u: 1760, v: 1040 }, perLine, noise),
    bentLine(k1, k2, { u: 100, v: 700 }, { u: 1800, v: 640 }, perLine, noise),
  ];
}

describe('plumb-line fit recovers known coefficients from synthetic straight lines', () => {
  // Truth: straight ideal segments, bent through the closed-form distortion of
  // lens-distortion.ts (itself checked against OpenCV in lens-distortion.test.ts).
  it('exact clicks: k1, k2 to 1e-6, residual ~0', () => {
    const fit = fitPlumbLines(scene(-0.21, 0.045), { widthPx: W, heightPx: H }, { terms: 2 });
    expect(fit.terms).toBe(2);
    expect(fit.coefficients.k1).toBeCloseTo(-0.21, 6);
    expect(fit.coefficients.k2).toBeCloseTo(0.045, 6);
    expect(fit.residualRmsPx).toBeLessThan(1e-6);
  });

  it('k1-only lens with the automatic choice: k2 comes out ~0', () => {
    const fit = fitPlumbLines(scene(-0.12, 0), { widthPx: W, heightPx: H });
    expect(fit.terms).toBe(2);
    expect(fit.coefficients.k1).toBeCloseTo(-0.12, 6);
    expect(Math.abs(fit.coefficients.k2)).toBeLessThan(1e-6);
  });

  it('after the fit the clicked lines are straight again', () => {
    const lines = scene(-0.18, 0.02);
    const fit = fitPlumbLines(lines, { widthPx: W, heightPx: H });
    const model = lensModelForFrame(W, H, fit.coefficients);
    // Sagitta of the bottom rail before and after (the middle point's distance from the end chord).
    const sag = (pts: PixelPoint[]) => {
      const a = pts[0], b = pts[pts.length - 1], m = pts[(pts.length - 1) / 2];
      return Math.abs((b.u - a.u) * (m.v - a.v) - (b.v - a.v) * (m.u - a.u)) / Math.hypot(b.u - a.u, b.v - a.v);
    };
    expect(sag(lines[0])).toBeGreaterThan(30);
    expect(sag(lines[0].map((p) => undistort(model, p)))).toBeLessThan(1e-4);
  });

  it('with 0.5 px click noise the 95 % intervals hold the truth about 95 % of the time (150 scenes)', () => {
    const rand = mulberry32(20261202);
    const gauss = normalDeviates(rand);
    const sigma = 0.5;
    let hitK1 = 0;
    let hitK2 = 0;
    let rmsSum = 0;
    const trials = 150;
    for (let t = 0; t < trials; t++) {
      const fit = fitPlumbLines(scene(-0.2, 0.04, 8, () => sigma * gauss()), { widthPx: W, heightPx: H }, { terms: 2 });
      if (Math.abs(fit.coefficients.k1 + 0.2) <= 1.96 * fit.standardUncertainty.k1) hitK1++;
      if (Math.abs(fit.coefficients.k2 - 0.04) <= 1.96 * fit.standardUncertainty.k2) hitK2++;
      rmsSum += fit.residualSigmaPx;
    }
    // Binomial(150, 0.95): 2.5 sd either side is 0.905–0.995. The residual σ
    // estimates the click noise across each line, which is σ (one component of
    // an isotropic σ per axis).
    expect(hitK1 / trials).toBeGreaterThan(0.9);
    expect(hitK1 / trials).toBeLessThanOrEqual(0.995);
    expect(hitK2 / trials).toBeGreaterThan(0.9);
    expect(hitK2 / trials).toBeLessThanOrEqual(0.995);
    expect(rmsSum / trials).toBeGreaterThan(0.9 * sigma);
    expect(rmsSum / trials).toBeLessThan(1.1 * sigma);
  }, 120_000);

  it('two lines of three points still fit k1 (and say k2 was left out)', () => {
    const lines = scene(-0.15, 0, 3).slice(0, 2);
    const fit = fitPlumbLines(lines, { widthPx: W, heightPx: H });
    expect(fit.terms).toBe(1);
    expect(fit.coefficients.k1).toBeCloseTo(-0.15, 6);
    expect(fit.notes.join(' ')).toMatch(/k2/);
  });

  it('the click σ floors the coefficient uncertainty', () => {
    const lines = scene(-0.15, 0.01);
    const exact = fitPlumbLines(lines, { widthPx: W, heightPx: H });
    const floored = fitPlumbLines(lines, { widthPx: W, heightPx: H }, { clickSigmaPx: 0.5 });
    expect(exact.standardUncertainty.k1).toBeLessThan(1e-6);
    expect(floored.standardUncertainty.k1).toBeGreaterThan(1e-4);
  });
});

describe('plumb-line fit refuses lines that cannot determine the distortion', () => {
  const frame = { widthPx: W, heightPx: H };
  const refuse = (lines: PixelPoint[][], pattern: RegExp) => {
    let err: unknown;
    try { fitPlumbLines(lines, frame); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(GeometryError);
    expect((err as GeometryError).message).toMatch(pattern);
    expect((err as GeometryError).field).toMatch(/^lens\.straightLines/);
  };
  it('one line', () => refuse(scene(-0.1, 0).slice(0, 1), /at least 2/));
  it('a line of two points', () => refuse([scene(-0.1, 0)[0], scene(-0.1, 0)[1].slice(0, 2)], /at least 3/));
  it('every line through the centre', () => refuse([
    [{ u: 100, v: 100 }, { u: 960, v: 540 }, { u: 1800, v: 1012.5 }],
    [{ u: 960, v: 40 }, { u: 960, v: 540 }, { u: 960, v: 1000 }],
  ], /centre/));
  it('all points on one line', () => refuse([
    [{ u: 100, v: 100 }, { u: 200, v: 110 }, { u: 300, v: 120 }],
    [{ u: 400, v: 130 }, { u: 500, v: 140 }, { u: 600, v: 150 }],
  ], /one straight line/));
  it('points bunched together', () => refuse([
    [{ u: 100, v: 100 }, { u: 101, v: 100 }, { u: 102, v: 100 }],
    scene(-0.1, 0)[0],
  ], /too close together/));
  it('a point that is not a number', () => refuse([
    [{ u: 100, v: 100 }, { u: Number.NaN, v: 100 }, { u: 900, v: 100 }],
    scene(-0.1, 0)[0],
  ], /not a number/));
});
