// Following the projectile frame by frame from marks it already has: predict,
// search a window around the prediction, take the nearest compact blob inside
// the gate, measure its centre, score it. Frames where nothing fits (behind a
// post) stay unmarked and the prediction carries on with a wider gate.
import { relativeGain } from './brightness';
import type { BackgroundModel } from './background-model';
import { markConfidence } from './confidence';
import { throwIfAborted, type FrameStore } from './frame-store';
import { predictAt, type Prediction, type TrackPoint } from './motion-model';
import type { Blob, SceneDiff } from './scene-diff';
import type { AutoMark, AutoMarkEndReason } from './types';

export interface TrackedMark extends AutoMark {
  coverage: number;
}

export interface TrackContext {
  store: FrameStore;
  model: BackgroundModel;
  diff: SceneDiff;
  polarity: 1 | -1;
  /** Projectile radius, px (from its coverage). */
  radiusPx: number;
  from: number;
  to: number;
  signal?: AbortSignal;
  /** Where the projectile rests before launch, when it was seen there. */
  restPosition: { u: number; v: number } | null;
  emit: (mark: TrackedMark) => Promise<void>;
  progress: (frameNumber: number) => void;
}

export const asPoint = (m: TrackedMark): TrackPoint => ({ frameNumber: m.frameNumber, u: m.uPx, v: m.vPx });

export type MeasureOutcome =
  | { kind: 'mark'; mark: TrackedMark }
  | { kind: 'none' }
  | { kind: 'partial' }
  | { kind: 'rest' };

/** Frames the track may skip (hidden) before it counts as lost. */
const MAX_GAP_FRAMES = 8;

export async function gainFor(ctx: TrackContext, frameNumber: number) {
  const frame = await ctx.store.get(frameNumber);
  return { frame, gain: relativeGain(ctx.model.data, frame.data, ctx.model.grid) };
}

function medianCoverage(history: TrackedMark[], near: number): number {
  const xs = [...history]
    .sort((a, b) => Math.abs(a.frameNumber - near) - Math.abs(b.frameNumber - near))
    .slice(0, 9)
    .filter((m) => m.confidence >= 0.5)
    .map((m) => m.coverage)
    .sort((a, b) => a - b);
  return xs.length ? xs[xs.length >> 1] : 0;
}

/** Measures the projectile at one frame, near a prediction. */
export async function measureAt(ctx: TrackContext, frameNumber: number, pred: Pick<Prediction, 'u' | 'v' | 'gatePx' | 'speedPx' | 'du' | 'dv'>, expectedCoverage: number): Promise<MeasureOutcome> {
  const { frame, gain } = await gainFor(ctx, frameNumber);
  ctx.diff.setFrame(frame, gain);
  const r = ctx.radiusPx;
  const half = Math.ceil(pred.gatePx + 3 * r + 0.5 * pred.speedPx + 4);
  const win = ctx.diff.measureWindow(pred.u, pred.v, half, ctx.polarity);
  if (!win) return { kind: 'none' };
  const minArea = Math.max(2, 0.15 * Math.PI * r * r);
  // Distance from the prediction to the blob's box: a blob merged with clutter has its centroid off the projectile.
  const near = (b: Blob) => {
    const x0 = b.bboxLeft;
    const y0 = b.bboxTop;
    const dx = Math.max(x0 - pred.u, 0, pred.u - (x0 + b.bboxWidth));
    const dy = Math.max(y0 - pred.v, 0, pred.v - (y0 + b.bboxHeight));
    return Math.hypot(dx, dy);
  };
  const candidates = win.blobs
    .filter((b) => b.area >= minArea && near(b) <= pred.gatePx)
    .sort((a, b) => near(a) - near(b) || Math.hypot(a.u - pred.u, a.v - pred.v) - Math.hypot(b.u - pred.u, b.v - pred.v));
  if (process.env.DEBUG_AUTOMARK) console.log('  window', frameNumber, win.blobs.map((b) => [b.u.toFixed(1), b.v.toFixed(1), b.area, b.peak.toFixed(0)].join(',')).join(' | '), 'exp', expectedCoverage.toFixed(1));
  for (const blob of candidates) {
    const c = ctx.diff.centroidOf(blob.label, { radiusPx: r, du: pred.du, dv: pred.dv, blurPx: 0.6 * pred.speedPx }, pred);
    if (!c) continue;
    const dist = Math.hypot(c.u - pred.u, c.v - pred.v);
    if (process.env.DEBUG_AUTOMARK) console.log('  cand', c.u.toFixed(2), c.v.toFixed(2), 'dist', dist.toFixed(2), 'cov', c.coverage.toFixed(1));
    if (dist > pred.gatePx) continue;
    if (c.touchesFrameEdge) return { kind: 'partial' };
    if (ctx.restPosition && Math.hypot(c.u - ctx.restPosition.u, c.v - ctx.restPosition.v) < Math.max(0.8, 0.25 * pred.speedPx)) return { kind: 'rest' };
    const coverageRatio = expectedCoverage > 0 ? c.coverage / expectedCoverage : 1;
    // Less than about two thirds of the usual coverage: cut by a post or a branch, so the centre would be biased.
    if (coverageRatio < 0.7) return { kind: 'partial' };
    // Another object: a blob of at least half the projectile's size and clearly above the noise, close by.
    const others = win.blobs.filter(
      (b) => b !== blob && b.area >= 0.5 * blob.area && b.peak >= 6 * ctx.diff.noise.smoothed && Math.hypot(b.u - c.u, b.v - c.v) < 3 * r + 6,
    );
    const score = markConfidence({
      snr: blob.peak / ctx.diff.noise.smoothed,
      gateRatio: dist / pred.gatePx,
      neighbour: others.length > 0,
      elongation: c.majorPx / Math.max(0.3, c.minorPx),
      coverageRatio: Math.min(1, coverageRatio),
    });
    return {
      kind: 'mark',
      mark: { frameNumber, uPx: c.u, vPx: c.v, confidence: score.confidence, reason: score.reason, coverage: c.coverage },
    };
  }
  return { kind: 'none' };
}

/**
 * Extends `history` frame by frame in `direction` until the projectile leaves
 * the frame, is lost, reaches its rest position (backward) or the range ends.
 */
export async function follow(ctx: TrackContext, history: TrackedMark[], direction: 1 | -1): Promise<{ endReason: AutoMarkEndReason | 'rest'; added: TrackedMark[] }> {
  const added: TrackedMark[] = [];
  const all = [...history];
  const edge = direction === 1 ? all.reduce((m, p) => Math.max(m, p.frameNumber), -Infinity) : all.reduce((m, p) => Math.min(m, p.frameNumber), Infinity);
  let misses = 0;
  const maxGap = direction === 1 ? MAX_GAP_FRAMES : 2;
  for (let f = edge + direction; direction === 1 ? f <= ctx.to : f >= ctx.from; f += direction) {
    throwIfAborted(ctx.signal);
    const pred = predictAt(all.map(asPoint), f);
    const r = ctx.radiusPx;
    const W = ctx.store.width;
    const H = ctx.store.height;
    if (pred.u < -r || pred.v < -r || pred.u > W + r || pred.v > H + r) return { endReason: 'left-frame', added };
    const out = await measureAt(ctx, f, pred, medianCoverage(all, f));
    if (process.env.DEBUG_AUTOMARK) console.log('follow', f, out.kind, pred.u.toFixed(2), pred.v.toFixed(2), pred.gatePx.toFixed(2), out.kind === 'mark' ? out.mark : '');
    ctx.progress(f);
    if (out.kind === 'rest') return { endReason: 'rest', added };
    if (out.kind === 'mark') {
      misses = 0;
      all.push(out.mark);
      added.push(out.mark);
      await ctx.emit(out.mark);
      continue;
    }
    const nearEdge = pred.u < r + 2 || pred.v < r + 2 || pred.u > W - r - 2 || pred.v > H - r - 2;
    if (nearEdge && out.kind !== 'none') continue;
    if (nearEdge) return { endReason: 'left-frame', added };
    misses++;
    if (misses > maxGap) return { endReason: 'lost', added };
  }
  return { endReason: 'end-of-clip', added };
}
