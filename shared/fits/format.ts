// How fit numbers are written: as many decimals as the 95 % interval earns
// (two significant digits of its half-width), so the page, the PDF and the
// exports never show digits the data cannot support.
import type { Estimate } from '../physics/types';

export function decimalsFor(halfWidth: number): number {
  if (!(halfWidth > 0) || !Number.isFinite(halfWidth)) return 3;
  return Math.min(8, Math.max(0, 1 - Math.floor(Math.log10(halfWidth))));
}

export function halfWidth(e: Estimate): number {
  return (e.ci95[1] - e.ci95[0]) / 2;
}

export function formatValue(e: Estimate): string {
  return e.value.toFixed(decimalsFor(halfWidth(e)));
}

export function formatInterval(e: Estimate): string {
  const d = decimalsFor(halfWidth(e));
  return `${e.ci95[0].toFixed(d)} to ${e.ci95[1].toFixed(d)}`;
}

/** "23.46 ± 0.12" style: value and the 95 % half-width. */
export function formatPlusMinus(e: Estimate): string {
  const h = halfWidth(e);
  const d = decimalsFor(h);
  return `${e.value.toFixed(d)} ± ${h.toFixed(d)}`;
}

export function formatNumber(value: number | null | undefined, decimals = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return value.toFixed(decimals);
}

export function formatScientific(value: number, digits = 2): string {
  return Number.isFinite(value) ? value.toExponential(digits) : '—';
}

/**
 * Pressure as people read it everywhere in Arcbench, on screen, in cautions, exports and the PDF:
 * kPa with four significant digits, trailing zeros dropped ("420 kPa", "101.3 kPa"). Values stay
 * in Pa on the wire and in the database; only the writing changes.
 */
export const PRESSURE_UNIT = 'kPa';
export function formatPressureKPa(pa: number | null | undefined, { withUnit = true }: { withUnit?: boolean } = {}): string {
  if (pa === null || pa === undefined || !Number.isFinite(pa)) return '—';
  const text = String(Number((pa / 1000).toPrecision(4))).replace('-', '\u2212');
  return withUnit ? `${text}\u00a0${PRESSURE_UNIT}` : text;
}

/**
 * A standard uncertainty or other small number in plain decimals with `digits` significant
 * digits ("0.00012", "0.034"): reports print no exponent notation such as "1.20e-4".
 */
export function formatSignificant(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(Math.abs(value))));
  return value.toFixed(Math.min(decimals, 15));
}

/** A large dimensionless number rounded to `digits` significant digits, grouped by three with thin spaces (SI Brochure §5.4.4): "120 000". */
export function formatGrouped(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const rounded = Number(value.toPrecision(digits));
  const [int, frac] = Math.abs(rounded).toFixed(Math.max(0, digits - 1 - Math.floor(Math.log10(Math.abs(rounded) || 1)))).split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
  return `${rounded < 0 ? '\u2212' : ''}${grouped}${frac ? `.${frac}` : ''}`;
}

/** A limit in a validation message ("must be between 50 and 110 kPa"): pressures in kPa like everywhere else. */
export function limitText(value: number, unit: string): string {
  return unit === 'Pa' ? formatPressureKPa(value) : `${value} ${unit}`;
}
