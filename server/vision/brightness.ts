// Frame brightness normalisation. Mains-lit scenes filmed at high frame rates
// pulse at twice the mains frequency (100 or 120 Hz), so consecutive frames
// differ by a near-uniform gain. Vignetting and the scene itself are static, so
// one gain per frame, relative to a reference picture, takes the pulse out.

/** Indices of a sparse grid of pixels (every `step` pixels in both directions), used for cheap robust statistics. */
export function sampleGrid(width: number, height: number, step: number): Int32Array {
  const cols = Math.max(1, Math.floor(width / step));
  const rows = Math.max(1, Math.floor(height / step));
  const out = new Int32Array(cols * rows);
  let k = 0;
  for (let r = 0; r < rows; r++) {
    const y = Math.floor((r + 0.5) * step);
    for (let c = 0; c < cols; c++) out[k++] = y * width + Math.floor((c + 0.5) * step);
  }
  return out;
}

export function medianOf(values: Float64Array | Float32Array | number[], count = values.length): number {
  if (count === 0) return NaN;
  const s = Float64Array.from(values.slice(0, count) as ArrayLike<number>).sort();
  const m = count >> 1;
  return count % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * The factor that brings `frame` to the brightness of `reference`: the median,
 * over the grid, of reference/frame. The median ignores moving things and the
 * projectile; very dark pixels carry little information about a gain and are skipped.
 */
export function relativeGain(reference: ArrayLike<number>, frame: Uint8Array, grid: Int32Array): number {
  const ratios = new Float64Array(grid.length);
  let n = 0;
  for (let k = 0; k < grid.length; k++) {
    const i = grid[k];
    const f = frame[i];
    const r = reference[i];
    if (f >= 16 && r >= 16) ratios[n++] = r / f;
  }
  const g = medianOf(ratios, n);
  return Number.isFinite(g) && g > 0 ? g : 1;
}
