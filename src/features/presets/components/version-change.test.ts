import { describe, expect, it } from 'vitest';
import { versionChangeCells } from './version-change';

describe('version change cells', () => {
  it('shows small fractions with the digits they need and a factor instead of an exploding percentage', () => {
    // The row that read "0.0 % → 0.1 % (+2345.6 %)": an efficiency uncertainty from 0.0041 % to 0.1 %.
    const cells = versionChangeCells(0.000041, 0.001, 'efficiencyStd');
    expect(cells.before).toBe('0.0041\u00a0%');
    expect(cells.after).toBe('0.1000\u00a0%');
    expect(cells.change).toBe('+0.096\u00a0pp (×24)');
    expect(cells.change).not.toContain('2345');
  });

  it('gives an ordinary change in absolute terms and percent', () => {
    expect(versionChangeCells(0.82, 0.85, 'dragCoefficient')).toEqual({ before: '0.820', after: '0.850', change: '+0.030 (+3.7\u00a0%)' });
    expect(versionChangeCells(0.05, 0.048, 'efficiency')).toEqual({ before: '5.0\u00a0%', after: '4.8\u00a0%', change: '\u22120.20\u00a0pp (\u22124.0\u00a0%)' });
  });

  it('has no change against no previous version', () => {
    expect(versionChangeCells(null, 0.47, 'dragCoefficient')).toEqual({ before: '—', after: '0.470', change: '' });
  });
});
