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
  emit: (mark: TrackedMark) => Promise<void>;
  progress: (frameNumber: number) => void;
}

export const asPoint = (m: TrackedMark): TrackPoint => ({ frameNumber: m.frameNumber, u: m.uPx, v: m.vPx });

export type MeasureOutcome =
  | { kind: 'mark'; mark: TrackedMark }
  | { kind: 'none' }
  | { kind: 'partial' };

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
  // Any component near the prediction may be the projectile (a faint one over foliage can be a pixel or two above
  // threshold); the coverage check below tells it from noise.
  const minArea = 1;
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
  for (const blob of candidates) {
    const c = ctx.diff.centroidOf(blob.label, { radiusPx: r, du: pred.du, dv: pred.dv, blurPx: 0.6 * pred.speedPx }, pred);
    if (!c) continue;
    const dist = Math.hypot(c.u - pred.u, c.v - pred.v);
    if (dist > pred.gatePx) continue;
    if (c.touchesFrameEdge) return { kind: 'partial' };
    const coverageRatio = expectedCoverage > 0 ? c.coverage / expectedCoverage : 1;
    // Less than two thirds of the usual coverage: cut by a post or a branch, so the centre would be biased.
    if (coverageRatio < 0.65) return { kind: 'partial' };
    // Another object: a blob of at least half the projectile's size and clearly above the noise, close by.
    const others = win.blobs.filter(
      (b) => b !== blob && b.area >= Math.max(3, 0.5 * blob.area) && b.peak >= 6 * ctx.diff.noise.smoothed && Math.hypot(b.u - c.u, b.v - c.v) < 3 * r + 6,
    );
    // Contrast against the noise here: the frame's own, or the busier temporal spread of this patch (foliage, ringing).
    const localNoise = Math.max(ctx.diff.noise.smoothed, (c.localSpread * ctx.diff.noise.smoothed) / ctx.diff.noise.raw);
    const score = markConfidence({
      snr: blob.peak / localNoise,
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
 * Going backward: is this the projectile at rest before launch? It is when the
 * frame before shows it in the same place (in flight it moves a step a frame;
 * on the first frame of flight it has already moved a part of one).
 */
async function sitsStill(ctx: TrackContext, mark: TrackedMark, pred: Prediction): Promise<boolean> {
  const f = mark.frameNumber - 1;
  if (f < ctx.from) return false;
  const still = Math.max(0.5, 0.1 * pred.speedPx);
  const out = await measureAt(ctx, f, { u: mark.uPx, v: mark.vPx, gatePx: 2 * still, speedPx: 0, du: pred.du, dv: pred.dv }, 0);
  return out.kind === 'mark' && Math.hypot(out.mark.uPx - mark.uPx, out.mark.vPx - mark.vPx) < still;
}

/**
 * Extends `history` frame by frame in `direction` until the projectile leaves
 * the frame, is lost, reaches its rest position (backward) or the range ends.
 */
export async function follow(ctx: TrackContext, history: TrackedMark[], direction: 1 | -1): Promise<{ endReason: AutoMarkEndReason | 'rest'; added: TrackedMark[] }> {
  const added: TrackedMark[] = [];
  const all = [...history];
  // Forward runs from the earliest mark, so frames inside the starting chain that were not measured get their turn.
  const have = new Set(all.map((m) => m.frameNumber));
  const edge = all.reduce((m, p) => Math.min(m, p.frameNumber), Infinity);
  let misses = 0;
  const maxGap = direction === 1 ? MAX_GAP_FRAMES : 2;
  for (let f = edge + direction; direction === 1 ? f <= ctx.to : f >= ctx.from; f += direction) {
    throwIfAborted(ctx.signal);
    if (have.has(f)) {
      misses = 0;
      continue;
    }
    const pred = predictAt(all.map(asPoint), f);
    const r = ctx.radiusPx;
    const W = ctx.store.width;
    const H = ctx.store.height;
    if (pred.u < -r || pred.v < -r || pred.u > W + r || pred.v > H + r) return { endReason: 'left-frame', added };
    const out = await measureAt(ctx, f, pred, medianCoverage(all, f));
    if (direction === -1 && out.kind === 'mark' && (await sitsStill(ctx, out.mark, pred))) return { endReason: 'rest', added };
    ctx.progress(f);
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
