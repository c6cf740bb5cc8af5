import { describe, expect, it } from 'vitest';
import { sampleStandardDeviation } from 'simple-statistics';
import { mulberry32, normalDeviates } from '../random/prng';
import { rollFromLevelLine } from './calibration-transform';
import { lensModelForFrame, undistort } from './lens-distortion';
import {
  correctedLevelLineRollSigmaRad, DEG_PER_RAD, launchAngleSigmaFromRollDeg, levelLineRollSigmaRad, rotateWorldPoints, statedRollSigmaRad, worldPointSigmaFromRoll,
} from './roll-uncertainty';

describe('roll uncertainty of a clicked level line', () => {
  it('√2 σ / L: a 400 px horizon clicked to 0.5 px is known to 0.101°', () => {
    const s = levelLineRollSigmaRad({ u: 100, v: 300 }, { u: 500, v: 300 }, 0.5);
    expect(s).toBeCloseTo(Math.SQRT2 * 0.5 / 400, 15);
    expect(s * DEG_PER_RAD).toBeCloseTo(0.1013, 4);
  });

  it('agrees with a Monte Carlo of the clicks through the roll formula itself (tilted line)', () => {
    const p1 = { u: 200, v: 640 }, p2 = { u: 1500, v: 560 };
    const sigma = 1.2;
    const gauss = normalDeviates(mulberry32(3));
    const rolls: number[] = [];
    for (let i = 0; i < 50_000; i++) {
      rolls.push(rollFromLevelLine(
        { u: p1.u + sigma * gauss(), v: p1.v + sigma * gauss() },
        { u: p2.u + sigma * gauss(), v: p2.v + sigma * gauss() },
      ) / DEG_PER_RAD);
    }
    expect(sampleStandardDeviation(rolls) / levelLineRollSigmaRad(p1, p2, sigma)).toBeCloseTo(1, 1);
  });

  it('through a correction: identity gives √2 σ / L; a correction that doubles lengths halves it; a lens that stretches the corners raises it', () => {
    const p1 = { u: 300, v: 900 }, p2 = { u: 1600, v: 880 };
    const plain = levelLineRollSigmaRad(p1, p2, 0.7);
    expect(correctedLevelLineRollSigmaRad(p1, p2, 0.7, (p) => p)).toBeCloseTo(plain, 9);
    expect(correctedLevelLineRollSigmaRad(p1, p2, 0.7, (p) => ({ u: 2 * p.u, v: 2 * p.v }))).toBeCloseTo(plain, 9);
    // Barrel undistortion stretches the frame's edges: the same clicks, measured on
    // corrected points that lie farther apart, still carry their frame-pixel σ, so the
    // result stays above √2 σ / L_corrected.
    const lens = lensModelForFrame(1920, 1080, { k1: -0.2, k2: 0.04 });
    const corrected = correctedLevelLineRollSigmaRad(p1, p2, 0.7, (p) => undistort(lens, p));
    const a = undistort(lens, p1), b = undistort(lens, p2);
    expect(corrected).toBeGreaterThan(levelLineRollSigmaRad(a, b, 0.7) * 1.05);
  });

  it('a stated roll ±0.5° is a rectangular 0.5/√3° (GUM §4.3.7)', () => {
    expect(statedRollSigmaRad(0.5) * DEG_PER_RAD).toBeCloseTo(0.5 / Math.sqrt(3), 14);
    expect(() => statedRollSigmaRad(-1)).toThrow(/between 0 and 45/);
  });
});

describe('propagation', () => {
  it('the launch angle carries the roll one to one; a point 10 m downrange moves 10 m × δ vertically', () => {
    expect(launchAngleSigmaFromRollDeg(0.01)).toBeCloseTo(0.5729578, 6);
    const s = worldPointSigmaFromRoll({ x: 10, y: 2 }, 0.001);
    expect(s.sigmaYM).toBeCloseTo(0.01, 15);
    expect(s.sigmaXM).toBeCloseTo(0.002, 15);
  });

  it('rotating points changes directions by the rotation and keeps lengths (so speeds)', () => {
    const pts = [{ xM: 0, yM: 0 }, { xM: 3, yM: 4 }];
    const r = rotateWorldPoints(pts, 0.1);
    expect(Math.hypot(r[1].xM, r[1].yM)).toBeCloseTo(5, 14);
    expect(Math.atan2(r[1].yM, r[1].xM)).toBeCloseTo(Math.atan2(4, 3) - 0.1, 14);
  });
});
