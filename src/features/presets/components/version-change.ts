import { formatNumber } from '@/lib/format';

// How the version history writes a numeric change. Fractions (efficiency and its
// uncertainty) are shown in percent; small values get the decimals they need to
// show two significant digits, so "0.0 % → 0.1 %" cannot happen; and a relative
// change is given only where it means something: against a value near zero a
// percentage explodes ("+2345.6 %"), so large changes read as a factor instead.

const MINUS = '\u2212';
const NBSP = '\u00a0';

const isFraction = (field: string) => field.startsWith('efficiency');

/** Decimals that show at least two significant digits of the smaller non-zero magnitude, never fewer than `base`. */
function decimalsFor(values: number[], base: number): number {
  const nonZero = values.map(Math.abs).filter((v) => v > 0 && Number.isFinite(v));
  if (nonZero.length === 0) return base;
  const smallest = Math.min(...nonZero);
  return Math.min(6, Math.max(base, 1 - Math.floor(Math.log10(smallest))));
}

export interface ChangeCells {
  before: string;
  after: string;
  change: string;
}

export function versionChangeCells(before: number | null, after: number, field: string): ChangeCells {
  const scale = isFraction(field) ? 100 : 1;
  const unit = isFraction(field) ? `${NBSP}%` : '';
  const shown = [after * scale, ...(before === null ? [] : [before * scale])];
  const d = decimalsFor(shown, isFraction(field) ? 1 : 3);
  const write = (v: number) => `${formatNumber(v * scale, { decimals: d })}${unit}`;
  if (before === null) return { before: '—', after: write(after), change: '' };
  const delta = (after - before) * scale;
  const dd = decimalsFor([delta], isFraction(field) ? 1 : 3);
  const sign = delta > 0 ? '+' : delta < 0 ? MINUS : '±';
  // Percentage points for fractions: "+0.096 pp", never a percent of a percent.
  const absolute = `${sign}${formatNumber(Math.abs(delta), { decimals: dd })}${isFraction(field) ? `${NBSP}pp` : ''}`;
  let relative = '';
  if (before !== 0 && delta !== 0) {
    const ratio = after / before;
    if (ratio > 0 && (ratio >= 2 || ratio <= 0.5)) relative = ` (×${formatNumber(ratio, { digits: 2, trim: true })})`;
    else if (ratio > 0) relative = ` (${delta > 0 ? '+' : MINUS}${formatNumber(Math.abs(ratio - 1) * 100, { decimals: 1 })}${NBSP}%)`;
  }
  return { before: write(before), after: write(after), change: `${absolute}${relative}` };
}
