/**
 * Renders a uniformly dark disc on a flat background with area-sampled
 * anti-aliasing (8×8 sub-samples per pixel), so the true centre is known
 * exactly. Pixel (i, j) covers [i, i+1) × [j, j+1).
 */
export function renderDisc(opts: {
  width: number;
  height: number;
  centreU: number;
  centreV: number;
  radiusPx: number;
  background: number;
  foreground: number;
  channels?: 1 | 4;
  noise?: () => number;
  /** Background shading, grey levels per pixel along u and v. */
  slope?: { u: number; v: number };
}): { width: number; height: number; channels: number; data: Uint8ClampedArray } {
  const { width, height, centreU, centreV, radiusPx, background, foreground } = opts;
  const channels = opts.channels ?? 1;
  const data = new Uint8ClampedArray(width * height * channels);
  const n = 8;
  const r2 = radiusPx * radiusPx;
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      let inside = 0;
      if (Math.abs(i + 0.5 - centreU) < radiusPx + 1 && Math.abs(j + 0.5 - centreV) < radiusPx + 1) {
        for (let a = 0; a < n; a++) {
          for (let b = 0; b < n; b++) {
            const du = i + (a + 0.5) / n - centreU;
            const dv = j + (b + 0.5) / n - centreV;
            if (du * du + dv * dv <= r2) inside++;
          }
        }
      }
      const f = inside / (n * n);
      const local = background + (opts.slope ? opts.slope.u * (i + 0.5 - centreU) + opts.slope.v * (j + 0.5 - centreV) : 0);
      const value = local + (foreground - local) * f + (opts.noise ? opts.noise() : 0);
      const k = (j * width + i) * channels;
      for (let c = 0; c < Math.min(channels, 3); c++) data[k + c] = Math.round(value);
      if (channels === 4) data[k + 3] = 255;
    }
  }
  return { width, height, channels, data };
}
