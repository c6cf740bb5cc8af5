import { describe, expect, it } from 'vitest';
import { snapToCentroid } from './snap';
import { mulberry32, normalDeviates } from '../random/prng';
import { renderDisc } from '../../tests/support/render-disc';

function medianOf(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

/** Renders discs at random sub-pixel centres, clicks within ±3 px of each, and returns the snap errors. */
function snapErrors(opts: { seed: number; trials: number; radiusPx: number; noiseSigma: number; channels?: 1 | 4; dark?: boolean }) {
  const rand = mulberry32(opts.seed);
  const normal = normalDeviates(rand);
  const errors: number[] = [];
  for (let t = 0; t < opts.trials; t++) {
    const cu = 30 + rand() * 10;
    const cv = 25 + rand() * 10;
    const image = renderDisc({
      width: 72,
      height: 64,
      centreU: cu,
      centreV: cv,
      radiusPx: opts.radiusPx,
      background: opts.dark === false ? 30 : 190,
      foreground: opts.dark === false ? 220 : 35,
      channels: opts.channels,
      noise: opts.noiseSigma > 0 ? () => opts.noiseSigma * normal() : undefined,
    });
    const clickU = cu + (rand() * 6 - 3);
    const clickV = cv + (rand() * 6 - 3);
    const snapped = snapToCentroid(image, clickU, clickV, { windowPx: 21, dark: opts.dark ?? true });
    expect(snapped, `trial ${t}`).not.toBeNull();
    errors.push(Math.hypot(snapped!.u - cu, snapped!.v - cv));
  }
  return errors;
}

describe('sub-pixel snap on rendered discs with known centres', () => {
  it('clean disc, radius 4 px, click ±3 px: median error well under 0.3 px', () => {
    const errors = snapErrors({ seed: 1, trials: 60, radiusPx: 4, noiseSigma: 0 });
    // An area-sampled symmetric disc has its centroid at the centre; what is left is 8-bit rounding.
    expect(medianOf(errors)).toBeLessThan(0.05);
    expect(Math.max(...errors)).toBeLessThan(0.15);
  });

  it('noisy disc (σ = 3 grey levels), radius 3 px: median error under 0.3 px', () => {
    const errors = snapErrors({ seed: 2, trials: 60, radiusPx: 3, noiseSigma: 3 });
    expect(medianOf(errors)).toBeLessThan(0.3);
  });

  it('shaded background (1.5 grey levels per px across the window) does not pull the centroid', () => {
    const rand = mulberry32(6);
    const errors: number[] = [];
    for (let t = 0; t < 30; t++) {
      const cu = 30 + rand() * 4;
      const cv = 30 + rand() * 4;
      const image = renderDisc({ width: 64, height: 64, centreU: cu, centreV: cv, radiusPx: 3, background: 150, foreground: 30, slope: { u: 1.5, v: -0.8 } });
      const s = snapToCentroid(image, cu + rand() * 6 - 3, cv + rand() * 6 - 3, { windowPx: 21 });
      expect(s).not.toBeNull();
      errors.push(Math.hypot(s!.u - cu, s!.v - cv));
    }
    expect(medianOf(errors)).toBeLessThan(0.1);
  });

  it('reads RGBA canvas pixels the same way', () => {
    const errors = snapErrors({ seed: 3, trials: 20, radiusPx: 4, noiseSigma: 0, channels: 4 });
    expect(medianOf(errors)).toBeLessThan(0.05);
  });

  it('bright projectile on a dark background with dark: false', () => {
    const errors = snapErrors({ seed: 4, trials: 20, radiusPx: 4, noiseSigma: 0, dark: false });
    expect(medianOf(errors)).toBeLessThan(0.05);
  });

  it('beats the unrefined click by a wide margin (the snap does something)', () => {
    const image = renderDisc({ width: 64, height: 64, centreU: 31.37, centreV: 30.81, radiusPx: 4, background: 190, foreground: 35 });
    const s = snapToCentroid(image, 33.9, 28.2, { windowPx: 21 })!;
    expect(Math.hypot(s.u - 31.37, s.v - 30.81)).toBeLessThan(0.1);
    expect(s.confidence).toBeGreaterThan(0.5);
  });

  it('returns null on plain background, noise only, or a click outside the frame', () => {
    const normal = normalDeviates(mulberry32(5));
    const flat = renderDisc({ width: 64, height: 64, centreU: -50, centreV: -50, radiusPx: 4, background: 180, foreground: 30 });
    expect(snapToCentroid(flat, 32, 32)).toBeNull();
    const noisy = renderDisc({ width: 64, height: 64, centreU: -50, centreV: -50, radiusPx: 4, background: 180, foreground: 30, noise: () => 2 * normal() });
    expect(snapToCentroid(noisy, 32, 32)).toBeNull();
    expect(snapToCentroid(flat, -1, 10)).toBeNull();
  });

  it('dark: true ignores a bright blob', () => {
    const bright = renderDisc({ width: 64, height: 64, centreU: 32, centreV: 32, radiusPx: 4, background: 30, foreground: 220 });
    expect(snapToCentroid(bright, 32, 32, { dark: true })).toBeNull();
  });
});
