import { chiSquaredDistributionTable, standardDeviation, sum, weightedMean } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { chiSquareUpperTail, logGamma } from './chi-square';
import { poolInverseVariance, type PoolInput } from './pool';

// Drag coefficients of five approved fits of one projectile, with their standard errors.
const FITS: PoolInput[] = [
  { id: 'a', value: 0.52, stdErr: 0.03 },
  { id: 'b', value: 0.49, stdErr: 0.02 },
  { id: 'c', value: 0.55, stdErr: 0.05 },
  { id: 'd', value: 0.5, stdErr: 0.025 },
  { id: 'e', value: 0.47, stdErr: 0.04 },
];

describe('inverse-variance pooling', () => {
  it('equals a direct computation with simple-statistics on the same fits', () => {
    // Reference: simple-statistics weightedMean with weights 1/σ² (fixed-effect
    // meta-analysis, Borenstein et al., Introduction to Meta-Analysis, ch. 11),
    // and the standard error 1/√Σw.
    const w = FITS.map((f) => 1 / f.stdErr ** 2);
    const mean = weightedMean(FITS.map((f) => f.value), w);
    const se = 1 / Math.sqrt(sum(w));
    const q = sum(FITS.map((f, i) => w[i] * (f.value - mean) ** 2));
    const pooled = poolInverseVariance(FITS);
    expect(pooled.value).toBeCloseTo(mean, 12);
    expect(pooled.stdErrFixed).toBeCloseTo(se, 12);
    expect(pooled.heterogeneity.cochranQ).toBeCloseTo(q, 12);
    expect(pooled.heterogeneity.degreesOfFreedom).toBe(4);
    // These five agree, so the carried uncertainty is the plain fixed-effect one.
    expect(pooled.heterogeneity.disagree).toBe(false);
    expect(pooled.stdErr).toBe(pooled.stdErrFixed);
  });

  it('with equal uncertainties reduces to the plain mean and σ/√n', () => {
    // Closed form: equal weights → arithmetic mean, SE = σ/√n.
    const xs = [0.44, 0.47, 0.5];
    const pooled = poolInverseVariance(xs.map((value, i) => ({ id: String(i), value, stdErr: 0.06 })));
    expect(pooled.value).toBeCloseTo(0.47, 12);
    expect(pooled.stdErrFixed).toBeCloseTo(0.06 / Math.sqrt(3), 12);
    // Q = Σ(x − x̄)²/σ² = (n − 1) s²/σ², with s the sample standard deviation.
    const s = standardDeviation(xs) * Math.sqrt(3 / 2);
    expect(pooled.heterogeneity.cochranQ).toBeCloseTo((2 * s * s) / 0.06 ** 2, 10);
  });

  it('identical inputs: Q = 0, I² = 0, no disagreement', () => {
    const pooled = poolInverseVariance([1, 2, 3].map((i) => ({ id: String(i), value: 0.47, stdErr: 0.02 })));
    expect(pooled.heterogeneity.cochranQ).toBeCloseTo(0, 14);
    expect(pooled.heterogeneity.iSquared).toBe(0);
    expect(pooled.heterogeneity.pValue).toBeCloseTo(1, 12);
    expect(pooled.heterogeneity.disagree).toBe(false);
    expect(pooled.heterogeneity.verdict).toMatch(/agree within their intervals/);
  });

  it('strongly discordant inputs are flagged and the uncertainty widened by the Birge ratio', () => {
    const inputs = [
      { id: 'a', value: 0.4, stdErr: 0.01 },
      { id: 'b', value: 0.6, stdErr: 0.01 },
      { id: 'c', value: 0.5, stdErr: 0.01 },
    ];
    const pooled = poolInverseVariance(inputs);
    // Q = (0.1² + 0.1² + 0)/0.01² = 200, df = 2, I² = 198/200.
    expect(pooled.heterogeneity.cochranQ).toBeCloseTo(200, 9);
    expect(pooled.heterogeneity.iSquared).toBeCloseTo(0.99, 12);
    expect(pooled.heterogeneity.disagree).toBe(true);
    expect(pooled.heterogeneity.verdict).toMatch(/disagree more than their intervals allow/);
    expect(pooled.stdErr).toBeCloseTo(pooled.stdErrFixed * 10, 10);
  });

  it('a single fit pools to itself without a heterogeneity claim', () => {
    const pooled = poolInverseVariance([{ id: 'a', value: 0.5, stdErr: 0.02 }]);
    expect(pooled.value).toBe(0.5);
    expect(pooled.stdErr).toBeCloseTo(0.02, 15);
    expect(pooled.heterogeneity.pValue).toBeNull();
  });

  it('refuses inputs without a positive uncertainty', () => {
    expect(() => poolInverseVariance([{ id: 'a', value: 0.5, stdErr: 0 }])).toThrow(/uncertainty/);
    expect(() => poolInverseVariance([])).toThrow(/nothing/);
  });
});

describe('chi-square upper tail', () => {
  it('matches the standard chi-square table (χ² = 3.841, 1 dof → p = 0.05)', () => {
    // Standard critical values to four figures (e.g. NIST/SEMATECH e-Handbook, table 1.3.6.7.4).
    expect(chiSquareUpperTail(3.841459, 1)).toBeCloseTo(0.05, 6);
    expect(chiSquareUpperTail(5.991465, 2)).toBeCloseTo(0.05, 6);
    expect(chiSquareUpperTail(6.634897, 1)).toBeCloseTo(0.01, 6);
    expect(chiSquareUpperTail(18.307038, 10)).toBeCloseTo(0.05, 6);
    expect(chiSquareUpperTail(2.705543, 1)).toBeCloseTo(0.1, 6);
  });

  it('agrees with simple-statistics’ chi-square table at every tabulated point (two decimals)', () => {
    for (const dof of [1, 2, 3, 4, 5, 8, 10, 20]) {
      const row = (chiSquaredDistributionTable as unknown as Record<number, Record<string, number>>)[dof];
      for (const p of ['0.1', '0.05', '0.025', '0.01']) {
        // The table rounds the critical value to 0.01, so compare the p-value loosely.
        expect(Math.abs(chiSquareUpperTail(row[p], dof) - Number(p))).toBeLessThan(Number(p) * 0.05 + 0.002);
      }
    }
  });

  it('closed form for 2 dof: P(χ²₂ > x) = e^(−x/2)', () => {
    for (const x of [0.1, 1, 4, 12, 40]) expect(chiSquareUpperTail(x, 2)).toBeCloseTo(Math.exp(-x / 2), 12);
  });

  it('log-gamma at known values: Γ(5) = 24, Γ(1/2) = √π', () => {
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 12);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 12);
  });
});
