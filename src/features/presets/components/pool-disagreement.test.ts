import { describe, expect, it } from 'vitest';
import type { PoolPreview, PooledSummary } from '@shared/schemas/presets';
import { disagreements } from './pool-disagreement';

const pooled = (over: Partial<PooledSummary>): PooledSummary => ({
  value: 0.8, stdErr: 0.02, stdErrFixed: 0.01, count: 5, cochranQ: 3, degreesOfFreedom: 4, iSquared: 0, pValue: 0.56, birgeRatio: 0.87, disagree: false, verdict: '', ...over,
});

describe('publishing fits that disagree', () => {
  it('states each disagreeing value with its I² and p-value, so the confirmation can name them', () => {
    // Q = 18.2 on 4 degrees of freedom: I² = (Q − df)/Q = 78 % (Higgins & Thompson 2002), p ≈ 0.0011.
    const preview = { dragCoefficient: pooled({ iSquared: 0.78, pValue: 0.0011, cochranQ: 18.2, disagree: true }), efficiency: pooled({}), notes: [] } as unknown as PoolPreview;
    expect(disagreements(preview)).toEqual(['Drag coefficient: I² 78% (Cochran’s Q p = 0.0011)']);
  });

  it('asks nothing when the fits agree', () => {
    const preview = { dragCoefficient: pooled({}), efficiency: pooled({}), notes: [] } as unknown as PoolPreview;
    expect(disagreements(preview)).toEqual([]);
  });
});
