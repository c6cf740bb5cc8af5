// Number formatting for measured and fitted values. Everything the UI prints
// about a shot goes through here so units, digits and intervals look the same
// on every page. A space between value and unit as the SI Brochure (9th ed.)
// asks; U+2212 minus and U+2013 en dash for ranges (typographic common practice).
// A fit's estimates are written with the digits their interval earns; that rule
// is shared with the PDF report and the exports (shared/fits/format.ts), so the
// functions for estimates below hand over to it.
import * as fitFormat from '@shared/fits/format';
import type { Estimate } from '@shared/physics/types';

const MINUS = '\u2212';
const EN_DASH = '\u2013';
const NBSP = '\u00a0';

export interface NumberFormat {
  /** Significant digits (default 4). Ignored when `decimals` is given. */
  digits?: number;
  /** Fixed number of decimals, e.g. 1 for angles in degrees. */
  decimals?: number;
  /** Drop trailing zeros after rounding ("30", "29.97"), for values that read best unpadded. */
  trim?: boolean;
}

/** Rounds to significant digits or fixed decimals; never prints exponent notation for everyday magnitudes. */
export function formatNumber(value: number | null | undefined, { digits = 4, decimals, trim = false }: NumberFormat = {}): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : `${MINUS}∞`;
  let text: string;
  if (decimals !== undefined) {
    text = value.toFixed(decimals);
  } else if (value === 0) {
    text = '0';
  } else {
    const magnitude = Math.floor(Math.log10(Math.abs(value)));
    if (magnitude >= 9 || magnitude <= -6) {
      text = value.toExponential(Math.max(0, digits - 1));
    } else {
      const places = Math.max(0, digits - 1 - magnitude);
      text = value.toFixed(places);
    }
  }
  // "-0.00" after rounding reads as a sign error; show plain zero.
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1);
  if (trim && text.includes('.') && !text.includes('e')) text = text.replace(/\.?0+$/, '');
  return text.replace('-', MINUS);
}

/** "23.41 m/s"; unit may be empty for dimensionless values such as a drag coefficient. */
export function formatQuantity(value: number | null | undefined, unit = '', options?: NumberFormat): string {
  const number = formatNumber(value, options);
  if (!unit || number === '—') return number;
  // Degrees and percent attach without a space (SI Brochure §5.4.3 makes the
  // degree of plane angle the exception; percent is common practice).
  const tight = unit === '°' || unit === '%';
  return tight ? `${number}${unit}` : `${number}${NBSP}${unit}`;
}

export interface Interval {
  low: number;
  high: number;
  /** e.g. 0.95 */
  level: number;
}

/**
 * "23.41 m/s (95%: 23.10–23.72)": the interval gets the same decimals as the
 * value so the two can be compared digit by digit.
 */
export function formatWithInterval(value: number, unit: string, interval: Interval | null | undefined, options: NumberFormat = {}): string {
  const main = formatQuantity(value, unit, options);
  if (!interval) return main;
  const decimals = options.decimals ?? decimalsOf(formatNumber(value, options));
  const low = formatNumber(interval.low, { decimals });
  const high = formatNumber(interval.high, { decimals });
  return `${main} (${formatPercent(interval.level)}: ${low}${EN_DASH}${high})`;
}

/**
 * "23.46–23.54 m/s": a band with enough decimals that its two ends differ (two significant
 * digits of its width, as for an uncertainty, GUM §7.2.6), and at least `minDecimals`.
 * A band of zero width is written as the one value.
 */
export function formatRange(low: number, high: number, unit = '', minDecimals = 1): string {
  const width = Math.abs(high - low);
  const decimals = width > 0 && Number.isFinite(width) ? Math.min(6, Math.max(minDecimals, 1 - Math.floor(Math.log10(width)))) : minDecimals;
  const lo = formatNumber(low, { decimals });
  const hi = formatNumber(high, { decimals });
  const body = lo === hi ? lo : `${lo}${EN_DASH}${hi}`;
  return unit ? `${body}${NBSP}${unit}` : body;
}

/** "23.41 ± 0.31 m/s" for a symmetric uncertainty. */
export function formatPlusMinus(value: number, halfWidth: number, unit = '', options: NumberFormat = {}): string {
  const decimals = options.decimals ?? decimalsOf(formatNumber(value, options));
  const body = `${formatNumber(value, { decimals })} ± ${formatNumber(halfWidth, { decimals })}`;
  if (!unit) return body;
  return unit === '°' ? `(${body})°` : `${body}${NBSP}${unit}`;
}

/** 0.95 → "95%", 0.999 → "99.9%". */
export function formatPercent(fraction: number, maxDecimals = 1): string {
  // Number() drops the trailing zeros toFixed leaves behind.
  const text = String(Number((fraction * 100).toFixed(maxDecimals)));
  return `${text.replace('-', MINUS)}%`;
}

function decimalsOf(text: string): number {
  const dot = text.indexOf('.');
  return dot < 0 || text.includes('e') ? 0 : text.length - dot - 1;
}

/** A date and time in the reader's locale, short and unambiguous: "2 Dec 2026, 14:05". */
export function formatDateTime(iso: string | Date | null | undefined): string {
  if (!iso) return '—';
  const date = typeof iso === 'string' ? new Date(iso) : iso;
  if (Number.isNaN(date.getTime())) return '—';
  return new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(date);
}

/**
 * A day in the reader's locale: "2 Dec 2026". A calendar date without a time ("2026-04-18", a series'
 * test date) is that day everywhere, so it is read and written in UTC and never slips to the day before.
 */
export function formatDate(iso: string | Date | null | undefined, locale?: string): string {
  if (!iso) return '—';
  const calendarDay = typeof iso === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(iso);
  const date = typeof iso === 'string' ? new Date(calendarDay ? `${iso}T00:00:00Z` : iso) : iso;
  if (Number.isNaN(date.getTime())) return '—';
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', ...(calendarDay ? { timeZone: 'UTC' } : {}) }).format(date);
}

/** Pressure, the one way the app writes it: kPa ("420 kPa", "101.3 kPa"); the same rule as the PDF and exports. */
export const formatPressure = (pa: number | null | undefined): string => fitFormat.formatPressureKPa(pa);

/** Bytes for upload sizes: "48.2 MB" (decimal prefixes, as disks and browsers show them). */
export function formatBytes(bytes: number): string {
  const units = ['B', 'kB', 'MB', 'GB', 'TB'];
  let value = bytes;
  let i = 0;
  while (Math.abs(value) >= 1000 && i < units.length - 1) {
    value /= 1000;
    i++;
  }
  return formatQuantity(value, units[i], i === 0 ? { decimals: 0 } : { digits: 3 });
}

/** A fitted value with as many decimals as its 95 % interval earns (same digits as the PDF report). */
export const formatEstimate = (e: Estimate): string => fitFormat.formatValue(e);

/** "23.31 to 23.62": the estimate's 95 % interval, to the same decimals as formatEstimate. */
export const formatEstimateInterval = (e: Estimate): string => fitFormat.formatInterval(e);

/** "1.2e+5": dimensionless numbers spanning decades, such as a Reynolds number. */
export const formatScientific = (value: number, digits = 2): string => fitFormat.formatScientific(value, digits);

/** Two significant digits are all an uncertainty deserves (GUM JCGM 100:2008 §7.2.6); trailing zeros dropped. */
export function formatUncertainty(u: number): string {
  return u === 0 ? '0' : String(Number(u.toPrecision(2))).replace('-', MINUS);
}
