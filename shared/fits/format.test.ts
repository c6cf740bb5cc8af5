import { describe, expect, it } from 'vitest';
import { decimalsFor, formatInterval } from './format';

describe('printed digits', () => {
  it('two significant digits of the 95 % half-width decide the decimals (GUM §7.2.6)', () => {
    expect(decimalsFor(0.12)).toBe(2);
    expect(decimalsFor(0.0095)).toBe(4);
    expect(decimalsFor(3.4)).toBe(1);
    expect(formatInterval({ value: 25.03, stdErr: 0.15, ci95: [24.727, 25.3297] })).toBe('24.73 to 25.33');
  });
});
