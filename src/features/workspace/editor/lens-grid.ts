// The corrected grid: a square grid of lines that are straight in the ideal
// (undistorted) picture, drawn where the lens shows them. When the lens model
// is right, the grid bows exactly as the fence rails and posts on the frame
// do, so a person can see the correction match the picture.
//
// The grid covers the whole frame: its ideal extent is the undistorted frame
// border (wider than the frame for a barrel lens, narrower for a pincushion),
// its lines pass through the distortion centre (where radial distortion bends
// nothing, so the middle cross stays straight) and each line is sampled
// densely, distorted point by point, and cut to the frame.
import { distort, undistort, type LensModel } from '@shared/geometry/lens-distortion';
import type { Point } from './types';

export interface FrameRect {
  width: number;
  height: number;
}

export interface LensGridOptions {
  /** Grid lines across the frame's height (the spacing is height / this); 8 by default. */
  rows?: number;
  /** Points per grid line before cutting to the frame; 64 by default. */
  samples?: number;
}

export interface LensGridLine {
  /** Which family the line belongs to in the ideal picture, and its offset from the centre there, px. */
  family: 'vertical' | 'horizontal';
  idealOffsetPx: number;
  points: Point[];
}

/** Bounding box of the undistorted frame border, in ideal pixels. */
export function idealExtent(model: LensModel, frame: FrameRect, perSide = 64) {
  let uMin = Infinity, uMax = -Infinity, vMin = Infinity, vMax = -Infinity, radiusMaxPx = 0;
  const take = (u: number, v: number) => {
    const p = undistort(model, { u, v });
    // Beyond the fold of the polynomial no ideal point is shown; leave it out.
    if (!Number.isFinite(p.u) || !Number.isFinite(p.v)) return;
    uMin = Math.min(uMin, p.u); uMax = Math.max(uMax, p.u);
    vMin = Math.min(vMin, p.v); vMax = Math.max(vMax, p.v);
    radiusMaxPx = Math.max(radiusMaxPx, Math.hypot(p.u - model.centre.u, p.v - model.centre.v));
  };
  for (let i = 0; i <= perSide; i++) {
    const f = i / perSide;
    take(f * frame.width, 0);
    take(f * frame.width, frame.height);
    take(0, f * frame.height);
    take(frame.width, f * frame.height);
  }
  return { uMin, uMax, vMin, vMax, radiusMaxPx };
}

const inside = (p: Point, frame: FrameRect) => p.u >= 0 && p.u <= frame.width && p.v >= 0 && p.v <= frame.height;

/** Splits a sampled line into the runs that lie on the frame. */
function cutToFrame(points: Point[], frame: FrameRect): Point[][] {
  const runs: Point[][] = [];
  let run: Point[] = [];
  for (const p of points) {
    if (inside(p, frame)) run.push(p);
    else if (run.length) {
      runs.push(run);
      run = [];
    }
  }
  if (run.length) runs.push(run);
  return runs.filter((r) => r.length >= 2);
}

/** Offsets k·step from the centre c that fall within [lo, hi]. */
function offsetsWithin(c: number, step: number, lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let k = Math.ceil((lo - c) / step); c + k * step <= hi; k++) out.push(k * step);
  return out;
}

export function lensGridLines(model: LensModel, frame: FrameRect, options: LensGridOptions = {}): LensGridLine[] {
  const rows = options.rows ?? 8;
  const samples = Math.max(2, options.samples ?? 64);
  const step = frame.height / rows;
  const box = idealExtent(model, frame);
  const { u: cu, v: cv } = model.centre;
  const lines: LensGridLine[] = [];
  const sample = (from: number, to: number) => Array.from({ length: samples }, (_, i) => from + ((to - from) * i) / (samples - 1));
  // Ideal points farther out than any the frame shows could come back onto the frame past a barrel lens's fold; they are not drawn.
  const shown = (p: Point) => Math.hypot(p.u - cu, p.v - cv) <= box.radiusMaxPx * (1 + 1e-9);
  const draw = (ideal: Point[]) => cutToFrame(ideal.map((p) => (shown(p) ? distort(model, p) : { u: Number.NaN, v: Number.NaN })), frame);
  for (const d of offsetsWithin(cu, step, box.uMin, box.uMax)) {
    const ideal = sample(box.vMin, box.vMax).map((v) => ({ u: cu + d, v }));
    for (const points of draw(ideal)) lines.push({ family: 'vertical', idealOffsetPx: d, points });
  }
  for (const d of offsetsWithin(cv, step, box.vMin, box.vMax)) {
    const ideal = sample(box.uMin, box.uMax).map((u) => ({ u, v: cv + d }));
    for (const points of draw(ideal)) lines.push({ family: 'horizontal', idealOffsetPx: d, points });
  }
  return lines;
}
