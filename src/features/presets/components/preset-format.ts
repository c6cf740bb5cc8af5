import { formatNumber, formatPressure } from '@/lib/format';

// Display helpers of the presets pages: pressures in kPa, fractions as percent, Cd to three decimals.
export const kPa = (pa: number | null | undefined) => formatPressure(pa);
export const cdText = (value: number, std?: number) => (std === undefined ? formatNumber(value, { decimals: 3 }) : `${formatNumber(value, { decimals: 3 })} ± ${formatNumber(std, { decimals: 3 })}`);
/** Percent with one decimal, or more when the uncertainty would otherwise print as ± 0.0. */
export const pctText = (value: number, std?: number) => {
  const decimals = std !== undefined && std > 0 ? Math.min(3, Math.max(1, 1 - Math.floor(Math.log10(std * 100)))) : 1;
  const v = formatNumber(value * 100, { decimals });
  return std === undefined ? `${v}\u00a0%` : `${v} ± ${formatNumber(std * 100, { decimals })}\u00a0%`;
};
export const metres = (m: number | null | undefined, decimals = 1) => (m === null || m === undefined ? '—' : `${formatNumber(m, { decimals })}\u00a0m`);
