import { describe, expect, it } from 'vitest';
import type { Estimate } from '@shared/physics/types';
import {
  formatEstimate, formatEstimateInterval, formatNumber, formatPercent, formatPlusMinus, formatQuantity, formatUncertainty, formatWithInterval,
} from './format';
import { formatDate, formatDateTime, formatPressure, formatRange } from './format';

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

// Expected strings follow the SI Brochure (BIPM, 9th edition, 2019), section
// "Formatting the value of a quantity" (§5.4.3, section number from memory):
// a space between number and unit symbol, except for the degree of plane
// angle. U+2212 MINUS and U+2013 EN DASH for ranges are typographic common
// practice, not a standard.
const NBSP = '\u00a0';

describe('formatNumber', () => {
  it('rounds to significant digits', () => {
    expect(formatNumber(23.4149)).toBe('23.41');
    expect(formatNumber(0.004567, { digits: 3 })).toBe('0.00457');
    expect(formatNumber(1234.5, { digits: 3 })).toBe('1235'); // integer part is never cut
  });
  it('uses fixed decimals when asked and a true minus sign', () => {
    expect(formatNumber(-3.14159, { decimals: 2 })).toBe('\u22123.14');
  });
  it('does not print a negative zero', () => {
    expect(formatNumber(-0.0001, { decimals: 2 })).toBe('0.00');
  });
  it('shows a dash for missing values', () => {
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
  });
});

describe('formatQuantity', () => {
  it('puts a non-breaking space before the unit (SI Brochure §5.4.3)', () => {
    expect(formatQuantity(23.41, 'm/s')).toBe(`23.41${NBSP}m/s`);
  });
  it('attaches the degree sign without a space (SI Brochure §5.4.3)', () => {
    expect(formatQuantity(41.5, '°', { decimals: 1 })).toBe('41.5°');
  });
});

describe('intervals', () => {
  it('writes a 95% interval with the value’s decimals', () => {
    expect(formatWithInterval(23.4149, 'm/s', { low: 23.1, high: 23.72, level: 0.95 })).toBe(`23.41${NBSP}m/s (95%: 23.10\u201323.72)`);
  });
  it('writes a symmetric uncertainty with ±', () => {
    expect(formatPlusMinus(0.4712, 0.0315, '', { digits: 3 })).toBe('0.471 ± 0.032');
  });
  it('prints confidence levels without trailing zeros', () => {
    expect(formatPercent(0.95)).toBe('95%');
    expect(formatPercent(0.999)).toBe('99.9%');
  });
});

describe('formatRange', () => {
  it('gives a narrow band enough digits that its ends differ', () => {
    // The forecast band that read "23.5–23.5 m/s".
    expect(formatRange(23.4612, 23.5388, 'm/s')).toBe('23.461\u201323.539\u00a0m/s');
    expect(formatRange(23.46, 23.54, 'm/s')).toBe('23.460\u201323.540\u00a0m/s');
    expect(formatRange(180.2, 215.9, 'm')).toBe('180.2\u2013215.9\u00a0m');
    expect(formatRange(1.234, 1.234, 's', 2)).toBe('1.23\u00a0s');
  });
});

describe('dates: one format, through Intl, in the reader’s locale', () => {
  it('writes a calendar day as that day in any time zone and locale', () => {
    expect(formatDate('2026-04-18', 'en-GB')).toBe('18 Apr 2026');
    expect(formatDate('2026-04-18', 'en-US')).toBe('Apr 18, 2026');
    expect(formatDate('2026-04-18', 'de-DE')).toBe('18. Apr. 2026');
    expect(formatDateTime('not a date')).toBe('—');
  });

  it('no page formats a date by itself (toLocaleString, raw ISO text): all go through src/lib/format.ts', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const root = join(__dirname, '..');
    const offenders: string[] = [];
    const walk = (dir: string) => {
      for (const entry of readdirSync(dir, { withFileTypes: true })) {
        const path = join(dir, entry.name);
        if (entry.isDirectory()) walk(path);
        else if (/\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name) && !path.endsWith(join('lib', 'format.ts'))) {
          readFileSync(path, 'utf8')
            .split('\n')
            .forEach((line, i) => {
              if (/toLocale(Date|Time)?String\(|new Intl\.DateTimeFormat/.test(line)) offenders.push(`${path.slice(root.length + 1)}:${i + 1}`);
            });
        }
      }
    };
    walk(root);
    expect(offenders).toEqual([]);
  });

  it('pressure is written in kPa', () => {
    expect(formatPressure(101_325)).toBe('101.3\u00a0kPa');
  });
});
