import { describe, expect, it } from 'vitest';
import { parityDomain } from './parity-domain';

describe('parity chart domain', () => {
  it('hugs shots clustered near 23 m/s instead of starting at zero', () => {
    const points = [
      { forecast: 23.1, measured: 23.4 },
      { forecast: 23.6, measured: 23.3 },
      { forecast: 24.2, measured: 24.6 },
    ];
    const [lo, hi] = parityDomain(points);
    expect(lo).toBeGreaterThan(20);
    expect(hi).toBeLessThan(27);
    for (const p of points) for (const v of [p.forecast, p.measured]) expect(v > lo && v < hi).toBe(true);
    // The points fill a good part of the plot, not a corner of it.
    expect((24.6 - 23.1) / (hi - lo)).toBeGreaterThan(0.4);
  });

  it('gives a single shot a readable span and never goes below zero for small positive values', () => {
    const [lo, hi] = parityDomain([{ forecast: 180, measured: 180 }]);
    expect(lo).toBeLessThan(180);
    expect(hi).toBeGreaterThan(180);
    expect(hi - lo).toBeGreaterThanOrEqual(9);
    expect(parityDomain([{ forecast: 0.2, measured: 3 }])[0]).toBe(0);
    expect(parityDomain([])).toEqual([0, 1]);
  });
});
