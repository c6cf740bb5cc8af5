import { describe, expect, it } from 'vitest';
import { scaleWithUncertainty } from './scale-uncertainty';
import { mulberry32, normalDeviates } from '../random/prng';

describe('pixels per metre and its uncertainty (GUM, JCGM 100:2008)', () => {
  it('combines a uniform length tolerance (§4.3.7: a/√3) and end-point σ (√2·σ) in quadrature', () => {
    // By hand: 200 px over 1.000 m ± 2 mm, σ = 0.5 px per end point.
    //   u_r(L)    = 0.002/√3 / 1      = 0.00115470054
    //   u_r(L_px) = √2·0.5 / 200      = 0.00353553391
    //   u_r(ppm)  = √(sum of squares) = 0.00371932
    const r = scaleWithUncertainty({ lengthPx: 200, lengthM: 1, lengthTolM: 0.002, endpointSigmaPx: 0.5 });
    expect(r.pixelsPerMetre).toBe(200);
    expect(r.lengthRel).toBeCloseTo(0.00115470054, 10);
    expect(r.pixelRel).toBeCloseTo(0.00353553391, 10);
    expect(r.relStdUncertainty).toBeCloseTo(0.00371932, 7);
    expect(r.stdUncertainty).toBeCloseTo(0.743864, 5);
  });

  it('agrees with a Monte Carlo propagation (GUM Supplement 1, JCGM 101:2008) within 3 %', () => {
    const lengthM = 0.5;
    const a = 0.003;
    const sigma = 0.8;
    const truePx = 150;
    const rand = mulberry32(2026);
    const normal = normalDeviates(rand);
    const samples: number[] = [];
    for (let i = 0; i < 200_000; i++) {
      const length = lengthM + (rand() * 2 - 1) * a; // uniform ±a
      const px = truePx + sigma * normal() - sigma * normal(); // each end point along the bar
      samples.push(px / length);
    }
    const mean = samples.reduce((s, x) => s + x, 0) / samples.length;
    const sd = Math.sqrt(samples.reduce((s, x) => s + (x - mean) ** 2, 0) / (samples.length - 1));
    const analytic = scaleWithUncertainty({ lengthPx: truePx, lengthM, lengthTolM: a, endpointSigmaPx: sigma });
    expect(Math.abs(sd / mean - analytic.relStdUncertainty) / analytic.relStdUncertainty).toBeLessThan(0.03);
  });
});
