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
