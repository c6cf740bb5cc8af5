// The static scene: a per-pixel temporal median of frames spread over the
// clip, each first brought to a common brightness. Anything that stays put
// (launcher, scale bar, fences, posts, foliage, vignetting) is in it; the
// projectile, which is at any one pixel for a frame or two, is not.
import { medianOf, relativeGain, sampleGrid } from './brightness';
import type { FrameStore } from './frame-store';

export interface BackgroundModel {
  width: number;
  height: number;
  /** Brightness-normalised gray levels, row-major. */
  data: Float32Array;
  /**
   * Temporal spread per pixel (from the central order statistics, a robust σ):
   * large where the picture is busy (foliage, compression ringing at post
   * edges, a lamp), so detection there needs a stronger difference.
   */
  spread: Float32Array;
  /** Sparse pixel grid used for gains and noise. */
  grid: Int32Array;
}

/** Spread `count` frame numbers evenly over [from, to]. */
export function spreadFrames(from: number, to: number, count: number): number[] {
  const n = Math.min(count, to - from + 1);
  if (n <= 1) return [from];
  return [...new Set(Array.from({ length: n }, (_, k) => Math.round(from + (k * (to - from)) / (n - 1))))];
}

/**
 * Width of the central order statistics tmp[m−j] … tmp[m+j] in σ for normal
 * samples: about 2 Φ⁻¹(½ + j/k), with Φ⁻¹(½ + d) ≈ √(2π)·d + (2π)^{3/2}/6·d³
 * (Taylor series of the normal quantile about the median).
 */
function centralWidthInSigma(j: number, k: number): number {
  const d = j / k;
  return 2 * (2.5066 * d + 2.625 * d ** 3);
}

/** Per-pixel median (and temporal spread) of the gain-normalised frames. */
export function medianStack(
  stack: Uint8Array[],
  gains: number[],
  length: number,
  out: Float32Array = new Float32Array(length),
  indices?: Iterable<number>,
  spreadOut?: Float32Array,
): Float32Array {
  const k = stack.length;
  const tmp = new Float32Array(k);
  const m = k >> 1;
  // The spread from the central order statistics only: a ball resting in the muzzle for a quarter
  // of the samples must not make the launcher look busy (an interquartile range would).
  const j = Math.max(1, Math.round(0.14 * (k - 1)));
  const lo = Math.max(0, m - j);
  const hi = Math.min(k - 1, m + j);
  const toSigma = 1 / centralWidthInSigma(hi - m, k);
  const each = indices ?? range(length);
  for (const p of each) {
    // Insertion sort: k is small (≤ 15) and this is the inner loop of the model.
    for (let j = 0; j < k; j++) {
      const x = stack[j][p] * gains[j];
      let i = j - 1;
      while (i >= 0 && tmp[i] > x) {
        tmp[i + 1] = tmp[i];
        i--;
      }
      tmp[i + 1] = x;
    }
    out[p] = k % 2 ? tmp[m] : 0.5 * (tmp[m - 1] + tmp[m]);
    if (spreadOut) spreadOut[p] = (tmp[hi] - tmp[lo]) * toSigma;
  }
  return out;
}

function* range(n: number) {
  for (let i = 0; i < n; i++) yield i;
}

export async function buildBackground(store: FrameStore, frameNumbers: number[]): Promise<BackgroundModel> {
  const { width, height } = store;
  const grid = sampleGrid(width, height, Math.max(4, Math.round(Math.sqrt((width * height) / 4000))));
  const frames = [];
  for (const n of frameNumbers) frames.push((await store.get(n)).data);
  const reference = frames[0];
  const gains = frames.map((f) => relativeGain(reference, f, grid));
  const spread = new Float32Array(width * height);
  const data = medianStack(frames, gains, width * height, undefined, undefined, spread);
  return { width, height, data, spread, grid };
}

/**
 * Rebuilds the model inside a rectangle from the given frames. Used around the
 * launcher: when the projectile rests in the muzzle for most of the clip, the
 * plain median keeps it there, and the first frames of flight would be measured
 * against a picture that still holds the ball.
 */
export async function patchBackground(
  model: BackgroundModel,
  store: FrameStore,
  frameNumbers: number[],
  rect: { x: number; y: number; width: number; height: number },
): Promise<void> {
  const frames = [];
  for (const n of frameNumbers) frames.push((await store.get(n)).data);
  const gains = frames.map((f) => relativeGain(model.data, f, model.grid));
  const x0 = Math.max(0, Math.floor(rect.x));
  const y0 = Math.max(0, Math.floor(rect.y));
  const x1 = Math.min(model.width, Math.ceil(rect.x + rect.width));
  const y1 = Math.min(model.height, Math.ceil(rect.y + rect.height));
  const idx: number[] = [];
  for (let y = y0; y < y1; y++) for (let x = x0; x < x1; x++) idx.push(y * model.width + x);
  medianStack(frames, gains, model.width * model.height, model.data, idx, model.spread);
}

/** Robust σ (MAD × 1.4826, Rousseeuw & Croux 1993) of `values`. */
export function robustSigma(values: Float64Array, count = values.length): number {
  const med = medianOf(values, count);
  const dev = new Float64Array(count);
  for (let i = 0; i < count; i++) dev[i] = Math.abs(values[i] - med);
  return 1.4826 * medianOf(dev, count);
}
