import { describe, expect, it } from 'vitest';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { mulberry32 } from '../random/prng';
import { planeOffsetFactor, planePixelsPerMetre } from './plane-offset';
import { GeometryError } from './points';

/** Pinhole projection (Hartley & Zisserman, MVG 2nd ed., eq. 6.1): camera at the origin looking along +Z, focal f px. */
function project(f: number, X: number, Y: number, Z: number) {
  return { u: 960 + (f * X) / Z, v: 540 - (f * Y) / Z };
}

describe('plane offset against the pinhole closed form', () => {
  it('a 1.000 m bar 0.25 m in front of a plane 8 m away: ratio of projected lengths = (D − δ)/D', () => {
    const f = 1400;
    const D = 8;
    const delta = 0.25;
    // The bar stands at depth D − δ, off-axis and low in the frame; a 1 m stretch of the flight plane at depth D.
    const a = project(f, -1.3, -0.8, D - delta), b = project(f, -0.3, -0.8, D - delta);
    const ppmRef = Math.hypot(b.u - a.u, b.v - a.v) / 1;
    const c = project(f, 2.1, 0.4, D), d = project(f, 3.1, 0.4, D);
    const ppmPlane = Math.hypot(d.u - c.u, d.v - c.v) / 1;
    const ours = planePixelsPerMetre(ppmRef, { planeDistanceM: D, planeDistanceTolM: 0, referenceOffsetM: delta, referenceOffsetTolM: 0 });
    expect(ours).toBeCloseTo(ppmPlane, 10);
    // Stated in the issue: 10 cm nearer, seen from 10 m, is a 1 % change of scale.
    expect(planeOffsetFactor({ planeDistanceM: 10, planeDistanceTolM: 0, referenceOffsetM: 0.1, referenceOffsetTolM: 0 }).factor).toBeCloseTo(0.99, 15);
  });

  it('a reference behind the plane (negative offset) reads fewer pixels per metre, so the factor exceeds 1', () => {
    const r = planeOffsetFactor({ planeDistanceM: 5, planeDistanceTolM: 0.1, referenceOffsetM: -0.2, referenceOffsetTolM: 0.05 });
    expect(r.factor).toBeCloseTo(1.04, 15);
  });

  it('first-order uncertainty agrees with a Monte Carlo of the rectangular inputs (GUM Supplement 1, JCGM 101:2008)', () => {
    const input = { planeDistanceM: 6, planeDistanceTolM: 0.5, referenceOffsetM: 0.6, referenceOffsetTolM: 0.1 };
    const r = planeOffsetFactor(input);
    const rand = mulberry32(7);
    const samples: number[] = [];
    for (let i = 0; i < 200_000; i++) {
      const D = input.planeDistanceM + (2 * rand() - 1) * input.planeDistanceTolM;
      const d = input.referenceOffsetM + (2 * rand() - 1) * input.referenceOffsetTolM;
      samples.push((D - d) / D);
    }
    expect(mean(samples)).toBeCloseTo(r.factor, 3);
    // The ratio is nearly linear over these tolerances: the first-order σ is within 2 % of the simulated one.
    const simulatedRel = sampleStandardDeviation(samples) / mean(samples);
    expect(r.relStdUncertainty / simulatedRel).toBeGreaterThan(0.98);
    expect(r.relStdUncertainty / simulatedRel).toBeLessThan(1.02);
  });

  it('refuses an offset as large as the distance, and non-positive distances, naming the field', () => {
    const bad = (input: Parameters<typeof planeOffsetFactor>[0], field: string) => {
      try { planeOffsetFactor(input); } catch (e) {
        expect(e).toBeInstanceOf(GeometryError);
        expect((e as GeometryError).field).toBe(field);
        return;
      }
      throw new Error('expected a refusal');
    };
    bad({ planeDistanceM: 2, planeDistanceTolM: 0, referenceOffsetM: 2.5, referenceOffsetTolM: 0 }, 'planeOffset.referenceOffsetM');
    bad({ planeDistanceM: 2, planeDistanceTolM: 0, referenceOffsetM: -2, referenceOffsetTolM: 0 }, 'planeOffset.referenceOffsetM');
    bad({ planeDistanceM: 0, planeDistanceTolM: 0, referenceOffsetM: 0, referenceOffsetTolM: 0 }, 'planeOffset.planeDistanceM');
    bad({ planeDistanceM: 3, planeDistanceTolM: -1, referenceOffsetM: 0, referenceOffsetTolM: 0 }, 'planeOffset.planeDistanceTolM');
  });
});
