import { describe, expect, it } from 'vitest';
import { normalQuantile, studentTCdf, studentTQuantile } from './student-t';

describe('Student t quantile', () => {
  // Source: standard two-sided t table (e.g. NIST/SEMATECH e-Handbook of
  // Statistical Methods, table 1.3.6.7.2), values to 3 decimals.
  const table: Array<[number, number, number]> = [
    [0.975, 1, 12.706], [0.975, 2, 4.303], [0.975, 5, 2.571], [0.975, 10, 2.228],
    [0.975, 30, 2.042], [0.975, 100, 1.984], [0.95, 5, 2.015], [0.995, 20, 2.845], [0.9, 3, 1.638],
  ];
  for (const [p, nu, expected] of table) {
    it(`t(${p}, ${nu}) = ${expected}`, () => {
      expect(studentTQuantile(p, nu)).toBeCloseTo(expected, 3);
    });
  }

  it('is the inverse of the CDF and symmetric', () => {
    for (const nu of [1, 2.5, 7, 40, 1000]) {
      for (const p of [0.6, 0.9, 0.975, 0.999]) {
        const t = studentTQuantile(p, nu);
        expect(studentTCdf(t, nu)).toBeCloseTo(p, 12);
        expect(studentTQuantile(1 - p, nu)).toBeCloseTo(-t, 10);
      }
    }
  });

  it('t(0.975, 1) has the closed form tan(pi (p - 1/2)) (Cauchy distribution, standard result)', () => {
    expect(studentTQuantile(0.975, 1)).toBeCloseTo(Math.tan(Math.PI * 0.475), 9);
  });

  it('tends to the normal quantile 1.959964 (standard normal table)', () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6);
    expect(studentTQuantile(0.975, 1e6)).toBeCloseTo(1.959966, 5);
  });
});
