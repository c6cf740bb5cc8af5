import { describe, expect, it } from 'vitest';
import { decimalsFor, formatInterval, formatPressureKPa } from './format';

describe('printed digits', () => {
  it('two significant digits of the 95 % half-width decide the decimals (GUM §7.2.6)', () => {
    expect(decimalsFor(0.12)).toBe(2);
    expect(decimalsFor(0.0095)).toBe(4);
    expect(decimalsFor(3.4)).toBe(1);
    expect(formatInterval({ value: 25.03, stdErr: 0.15, ci95: [24.727, 25.3297] })).toBe('24.73 to 25.33');
  });
});

describe('pressure', () => {
  it('is written in kPa everywhere, never raw Pa', () => {
    expect(formatPressureKPa(420000)).toBe('420\u00a0kPa');
    // ICAO standard atmosphere sea-level pressure, 101 325 Pa (ISO 2533:1975)
    expect(formatPressureKPa(101325)).toBe('101.3\u00a0kPa');
    expect(formatPressureKPa(1_234_000)).toBe('1234\u00a0kPa');
    expect(formatPressureKPa(650000, { withUnit: false })).toBe('650');
    expect(formatPressureKPa(null)).toBe('—');
  });
});

describe('report numbers without exponents', () => {
  it('writes small uncertainties in plain decimals and large numbers grouped by three', async () => {
    const { formatSignificant, formatGrouped } = await import('./format');
    expect(formatSignificant(0.000123)).toBe('0.00012');
    expect(formatSignificant(0.0345)).toBe('0.035');
    expect(formatSignificant(0)).toBe('0');
    expect(formatSignificant(12.6)).toBe('13');
    expect(formatGrouped(123_456)).toBe('120\u2009000');
    expect(formatGrouped(4_870, 3)).toBe('4\u2009870');
    expect(formatGrouped(0.5, 2)).toBe('0.50');
  });
});

describe('validation limits', () => {
  it('states pressure limits in kPa and other limits in their own unit', async () => {
    const { limitText } = await import('./format');
    expect(limitText(5e4, 'Pa')).toBe('50\u00a0kPa');
    expect(limitText(5e7, 'Pa')).toBe('50000\u00a0kPa');
    expect(limitText(90, '°')).toBe('90 °');
  });
});
