import { describe, expect, it } from 'vitest';
import { leastSquares } from './least-squares';
import { linearLeastSquares } from './linear-least-squares';
import { mulberry32, normalDeviates } from '../random/prng';

describe('generic least squares', () => {
  const noise = normalDeviates(mulberry32(99));
  const x = Array.from({ length: 40 }, (_, i) => i / 10);
  const y = x.map((v) => 2 - 0.7 * v + 0.05 * v * v + 0.01 * noise());

  it('on a model linear in its parameters it reproduces the QR linear solution and covariance', () => {
    const lin = linearLeastSquares(x.map((v) => [1, v, v * v]), y);
    const nl = leastSquares({
      observations: y,
      start: [0, 0, 0],
      typicalMagnitude: [1, 1, 1],
      model: (b, out) => { for (let i = 0; i < x.length; i++) out[i] = b[0] + b[1] * x[i] + b[2] * x[i] * x[i]; },
    });
    for (let j = 0; j < 3; j++) {
      expect(nl.params[j]).toBeCloseTo(lin.params[j], 9);
      expect(nl.stdErrors[j] / Math.sqrt(lin.covariance[j][j])).toBeCloseTo(1, 6);
    }
    expect(nl.converged).toBe(true);
    expect(nl.dof).toBe(37);
  });

  it('weights: doubling all sigmas leaves estimates and standard errors unchanged (s^2 absorbs the scale)', () => {
    const model = (b: Float64Array, out: Float64Array) => { for (let i = 0; i < x.length; i++) out[i] = b[0] * Math.exp(b[1] * x[i]); };
    const a = leastSquares({ observations: y, start: [2, -0.3], model, weights: x.map(() => 1) });
    const b = leastSquares({ observations: y, start: [2, -0.3], model, weights: x.map(() => 0.5) });
    expect(b.params[0]).toBeCloseTo(a.params[0], 10);
    expect(b.stdErrors[1] / a.stdErrors[1]).toBeCloseTo(1, 8);
    expect(b.rss / a.rss).toBeCloseTo(0.25, 10);
  });

  it('refuses more parameters than observations', () => {
    expect(() => leastSquares({ observations: [1, 2], start: [0, 0], model: () => {} })).toThrow(RangeError);
  });
});
