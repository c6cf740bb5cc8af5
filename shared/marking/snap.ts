// Sub-pixel snap: refine a click to the intensity-weighted centroid of the
// projectile inside a small window, against the local background.
//
// Why this shape: a projectile in a high-frame-rate clip is a small dark blob
// on a lighter sky or backdrop, blurred over a few pixels. The first moment of
// its contrast against the background is an unbiased centre estimate for any
// symmetric blob, to a small fraction of a pixel, where the brightest/darkest
// pixel is only good to ±0.5 px. Pixel (i, j) covers [i, i+1) × [j, j+1), so
// its centre is (i + 0.5, j + 0.5) in the same continuous coordinates marks use.
import { SNAP_WINDOW_PX } from '../defaults';

export interface SnapImage {
  width: number;
  height: number;
  /** Row-major samples, `channels` per pixel (1 grey, 2 grey+alpha, 3 RGB, 4 RGBA). */
  data: Uint8Array | Uint8ClampedArray;
  channels: number;
}

export interface SnapOptions {
  /** Side of the square search window, pixels (odd; even values grow by one). */
  windowPx?: number;
  /** true: a dark projectile on a lighter background; false: a bright one on a dark background. */
  dark?: boolean;
  /** Re-centred passes; the first pass may see the blob cut by the window edge. */
  iterations?: number;
  /** Noise threshold in robust standard deviations of the background (common practice: 3). */
  noiseK?: number;
}

export interface SnapResult {
  u: number;
  v: number;
  /** 0…1, a heuristic: contrast over noise, reduced when the blob touches the window edge. */
  confidence: number;
}

/** MAD → σ for normally distributed noise: 1/Φ⁻¹(3/4) ≈ 1.4826 (Rousseeuw & Croux, 1993). */
const MAD_TO_SIGMA = 1.4826;
/** Smallest contrast (grey levels of 255) we accept as "something is there"; from experience with 8-bit clips. */
const MIN_PEAK_CONTRAST = 6;

export function intensityAt(image: SnapImage, i: number, j: number): number {
  const k = (j * image.width + i) * image.channels;
  const d = image.data;
  if (image.channels >= 3) return 0.299 * d[k] + 0.587 * d[k + 1] + 0.114 * d[k + 2]; // Rec. 601 luma
  return d[k];
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Least-squares plane g = a + b·x + c·y through the border samples, refitted
 * once without samples beyond 3 robust σ (the projectile may overlap the
 * border when the click is off). σ is the MAD of the residuals, scaled.
 */
function robustPlane(samples: { i: number; j: number; g: number }[]): { a: number; b: number; c: number; sigma: number } {
  let fit = fitPlane(samples);
  let resid = samples.map((s) => s.g - (fit.a + fit.b * s.i + fit.c * s.j));
  let sigma = MAD_TO_SIGMA * median(resid.map(Math.abs));
  const kept = samples.filter((_, k) => Math.abs(resid[k]) <= 3 * Math.max(sigma, 0.5));
  if (kept.length >= 8 && kept.length < samples.length) {
    fit = fitPlane(kept);
    resid = kept.map((s) => s.g - (fit.a + fit.b * s.i + fit.c * s.j));
    sigma = MAD_TO_SIGMA * median(resid.map(Math.abs));
  }
  return { ...fit, sigma };
}

function fitPlane(samples: { i: number; j: number; g: number }[]): { a: number; b: number; c: number } {
  // Normal equations of the 3-parameter fit, solved by Cramer's rule (3×3, well conditioned on a square border).
  let n = 0, sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0, sg = 0, sxg = 0, syg = 0;
  for (const { i: x, j: y, g } of samples) {
    n++;
    sx += x;
    sy += y;
    sxx += x * x;
    syy += y * y;
    sxy += x * y;
    sg += g;
    sxg += x * g;
    syg += y * g;
  }
  const det3 = (m: number[]) => m[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * m[7] - m[4] * m[6]);
  const A = [n, sx, sy, sx, sxx, sxy, sy, sxy, syy];
  const d = det3(A);
  if (Math.abs(d) < 1e-9) return { a: sg / Math.max(1, n), b: 0, c: 0 };
  const a = det3([sg, sx, sy, sxg, sxx, sxy, syg, sxy, syy]) / d;
  const b = det3([n, sg, sy, sx, sxg, sxy, sy, syg, syy]) / d;
  const c = det3([n, sx, sg, sx, sxx, sxg, sy, sxy, syg]) / d;
  return { a, b, c };
}

interface Pass {
  u: number;
  v: number;
  peak: number;
  sigma: number;
  edgeFraction: number;
}

function centroidPass(image: SnapImage, cu: number, cv: number, half: number, dark: boolean, noiseK: number): Pass | null {
  const ci = Math.floor(cu);
  const cj = Math.floor(cv);
  const i0 = Math.max(0, ci - half);
  const i1 = Math.min(image.width - 1, ci + half);
  const j0 = Math.max(0, cj - half);
  const j1 = Math.min(image.height - 1, cj + half);
  if (i1 - i0 < 4 || j1 - j0 < 4) return null;

  // Background: a plane fitted to the window's border pixels, so a gentle
  // shading across the window (sky gradient, lit wall) does not pull the centroid.
  const border: { i: number; j: number; g: number }[] = [];
  const addBorder = (i: number, j: number) => border.push({ i: i + 0.5 - cu, j: j + 0.5 - cv, g: intensityAt(image, i, j) });
  for (let i = i0; i <= i1; i++) {
    addBorder(i, j0);
    addBorder(i, j1);
  }
  for (let j = j0 + 1; j < j1; j++) {
    addBorder(i0, j);
    addBorder(i1, j);
  }
  const plane = robustPlane(border);
  const backgroundAt = (i: number, j: number) => plane.a + plane.b * (i + 0.5 - cu) + plane.c * (j + 0.5 - cv);
  const sigma = Math.max(0.5, plane.sigma);
  const threshold = noiseK * sigma;

  let sw = 0;
  let su = 0;
  let sv = 0;
  let peak = 0;
  let edge = 0;
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const raw = intensityAt(image, i, j);
      const background = backgroundAt(i, j);
      const contrast = dark ? background - raw : raw - background;
      if (contrast > peak) peak = contrast;
      // Subtracting the threshold (not just cutting at it) keeps the weight continuous, so noise at the cut adds no jitter.
      const w = contrast - threshold;
      if (w <= 0) continue;
      sw += w;
      su += w * (i + 0.5);
      sv += w * (j + 0.5);
      if (i === i0 || i === i1 || j === j0 || j === j1) edge += w;
    }
  }
  if (sw <= 0 || peak < Math.max(MIN_PEAK_CONTRAST, 2 * threshold)) return null;
  return { u: su / sw, v: sv / sw, peak, sigma, edgeFraction: edge / sw };
}

/**
 * Refines a click to the projectile's centroid, or returns null when nothing
 * stands out from the background in the window (or the result wandered off
 * more than half a window from the click, i.e. it locked onto something else).
 */
export function snapToCentroid(image: SnapImage, clickU: number, clickV: number, options: SnapOptions = {}): SnapResult | null {
  const windowPx = Math.max(5, Math.round(options.windowPx ?? SNAP_WINDOW_PX));
  const half = Math.floor(windowPx / 2);
  const dark = options.dark ?? true;
  const iterations = Math.max(1, options.iterations ?? 3);
  const noiseK = options.noiseK ?? 3;
  if (!(clickU >= 0 && clickV >= 0 && clickU < image.width && clickV < image.height)) return null;

  let u = clickU;
  let v = clickV;
  let last: Pass | null = null;
  for (let k = 0; k < iterations; k++) {
    const pass = centroidPass(image, u, v, half, dark, noiseK);
    if (!pass) return last ? finish(last) : null;
    const moved = Math.hypot(pass.u - u, pass.v - v);
    u = pass.u;
    v = pass.v;
    last = pass;
    if (moved < 0.01) break;
  }
  if (!last || Math.hypot(u - clickU, v - clickV) > half) return null;
  return finish(last);

  function finish(p: Pass): SnapResult | null {
    if (Math.hypot(p.u - clickU, p.v - clickV) > half) return null;
    const snr = p.peak / p.sigma;
    const confidence = (snr / (snr + 10)) * (1 - p.edgeFraction);
    return { u: p.u, v: p.v, confidence: Math.max(0, Math.min(1, confidence)) };
  }
}
