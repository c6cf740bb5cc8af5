import { describe, expect, it } from 'vitest';
import type { Estimate } from '@shared/physics/types';
import { formatEstimate, formatEstimateInterval, formatNumber, formatQuantity, formatUncertainty } from './format';

describe('formatNumber trim', () => {
  it('drops padding zeros only when asked', () => {
    expect(formatNumber(30, { decimals: 3, trim: true })).toBe('30');
    expect(formatNumber(29.97002997, { decimals: 3, trim: true })).toBe('29.97');
    expect(formatNumber(29.97002997, { decimals: 3 })).toBe('29.970');
    expect(formatQuantity(240, 'fps', { decimals: 3, trim: true })).toBe('240\u00a0fps');
  });
});

describe('formatUncertainty', () => {
  // GUM JCGM 100:2008 §7.2.6: an uncertainty is quoted to at most two significant digits.
  it('keeps two significant digits and no padding', () => {
    expect(formatUncertainty(0.012345)).toBe('0.012');
    expect(formatUncertainty(0.1)).toBe('0.1');
    expect(formatUncertainty(1234)).toBe('1200');
    expect(formatUncertainty(0)).toBe('0');
  });
});

describe('estimates', () => {
  // Half-width 0.155 → two significant digits of it → 2 decimals (the rule of shared/fits/format, also used by the PDF).
  const e: Estimate = { value: 23.4567, stdErr: 0.08, ci95: [23.3017, 23.6117] };
  it('prints a fitted value with the decimals its interval earns, as the PDF does', () => {
    expect(formatEstimate(e)).toBe('23.46');
    expect(formatEstimateInterval(e)).toBe('23.30 to 23.61');
  });
});
