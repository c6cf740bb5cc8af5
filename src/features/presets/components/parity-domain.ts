// The axes of a measured-against-forecast (parity) chart: both axes share one domain so
// the diagonal stays at 45°, and that domain hugs the data instead of starting at zero,
// where a cluster of shots near 23 m/s would crowd into one corner.

export interface ParityPoint {
  forecast: number;
  measured: number;
}

/** One step of the 1-2-5 sequence at or above `raw` (common practice for axis ticks). */
function niceStep(raw: number): number {
  const power = 10 ** Math.floor(Math.log10(raw));
  const f = raw / power;
  return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * power;
}

/** [low, high] covering every point with a margin, rounded out to round numbers; both axes use it. */
export function parityDomain(points: ParityPoint[]): [number, number] {
  const values = points.flatMap((p) => [p.forecast, p.measured]).filter(Number.isFinite);
  if (values.length === 0) return [0, 1];
  let lo = Math.min(...values);
  let hi = Math.max(...values);
  // A single shot, or shots that agree to the digit, still get a readable span: 5 % of the value (or 1 unit).
  const minSpan = Math.max(Math.abs(hi) * 0.05, 1e-9) || 1;
  if (hi - lo < minSpan) {
    const mid = (hi + lo) / 2;
    lo = mid - minSpan / 2;
    hi = mid + minSpan / 2;
  }
  const pad = (hi - lo) * 0.1;
  const step = niceStep((hi - lo + 2 * pad) / 5);
  let low = Math.floor((lo - pad) / step) * step;
  const high = Math.ceil((hi + pad) / step) * step;
  // Speeds and ranges are never negative: do not pad below zero.
  if (lo >= 0 && low < 0) low = 0;
  return [Number(low.toPrecision(12)), Number(high.toPrecision(12))];
}
