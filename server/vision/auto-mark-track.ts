// autoMarkTrack: marks a projectile through a clip by itself (or from one seed
// click), with a confidence per mark. The steps:
//   1. a background model of the static scene (temporal median, brightness-normalised);
//   2. find the projectile: a chain of compact moving blobs that behaves ballistically
//      and starts at the launcher (find-projectile.ts), or the blob under the seed click;
//   3. rebuild the background around the launcher from frames after the launch (a ball
//      resting in the muzzle for most of the clip would otherwise be part of it);
//   4. follow it backward to the launch (stopping where it sits still: at rest) and forward
//      until it leaves the frame, is lost, or the clip ends (track-follower.ts).
// OpenCV (WebAssembly) does the image work; its memory is freed before returning.
import { buildBackground, patchBackground, spreadFrames } from './background-model';
import { findProjectile, type ChainPoint, type FoundProjectile } from './find-projectile';
import { FrameStore, throwIfAborted } from './frame-store';
import { predictAt } from './motion-model';
import { loadOpenCv } from './opencv';
import { SceneDiff, type Blob } from './scene-diff';
import { follow, gainFor, measureAt, type TrackContext, type TrackedMark } from './track-follower';
import type { AutoMark, AutoMarkOptions, AutoMarkOutcome, AutoMarkSeed, FrameSource } from './types';

export type { AutoMark, AutoMarkOptions, AutoMarkOutcome, AutoMarkSeed, FrameSource, GrayFrame } from './types';
export { AutoMarkAbortError } from './frame-store';

/** Frames in the background median: enough that a moving thing is a minority at every pixel, few enough to read fast. */
const BACKGROUND_SAMPLES = 15;

export async function autoMarkTrack(frames: FrameSource, options: AutoMarkOptions = {}): Promise<AutoMarkOutcome> {
  const from = Math.max(0, Math.floor(options.fromFrame ?? 0));
  const to = Math.min(frames.frameCount - 1, Math.floor(options.toFrame ?? frames.frameCount - 1));
  if (!(to - from >= 2)) throw new RangeError(`need at least three frames to track (from ${from} to ${to})`);
  const seed = options.seed;
  if (seed && (seed.frameNumber < from || seed.frameNumber > to || !(seed.uPx >= 0 && seed.vPx >= 0 && seed.uPx < frames.width && seed.vPx < frames.height))) {
    throw new RangeError('the seed lies outside the frames being marked');
  }
  throwIfAborted(options.signal);
  const cv = await loadOpenCv();
  throwIfAborted(options.signal);

  // About 200 MB of decoded frames at most (48 frames of 720p, 8 of 4K): the tracker looks a few frames back.
  const store = new FrameStore(frames, Math.max(8, Math.min(48, Math.floor(200e6 / (frames.width * frames.height)))), options.signal);
  const samples = spreadFrames(from, to, BACKGROUND_SAMPLES);
  const model = await buildBackground(store, samples);
  const diff = new SceneDiff(cv, model);
  try {
    const total = to - from + 1;
    let done = 0;
    const progress = (f: number) => {
      const fraction = Math.min(1, (f - from + 1) / total);
      if (fraction > done) {
        done = fraction;
        options.onProgress?.(fraction);
      }
    };
    const decided = new Map<number, TrackedMark>();
    const ctx: TrackContext = {
      store,
      model,
      diff,
      polarity: 1,
      radiusPx: 3,
      from,
      to,
      signal: options.signal,
      progress,
      emit: async (mark) => {
        throwIfAborted(options.signal);
        if (decided.has(mark.frameNumber)) return;
        decided.set(mark.frameNumber, mark);
        await options.onMark?.(publicMark(mark));
      },
    };

    // Noise of the differences, on a frame the median did not see.
    const noiseFrame = Math.min(to, samples.length > 1 ? samples[Math.floor(samples.length / 2)] + 1 : from);
    const { frame, gain } = await gainFor(ctx, noiseFrame);
    diff.setFrame(frame, gain);
    diff.estimateNoise();

    const found = seed ? await startFromSeed(ctx, seed) : await findProjectile(ctx, options.originHint ?? null);
    if (!found) return { marks: [], launchFrame: null, endReason: 'lost' };

    const chain = found.chain;
    ctx.polarity = majorityPolarity(chain.map((p) => p.blob));
    ctx.radiusPx = Math.max(1, Math.sqrt(median(chain.map((p) => p.blob.area)) / Math.PI));
    const stepPx = Math.hypot(chain[1].u - chain[0].u, chain[1].v - chain[0].v);

    if (chain[0].frameNumber > from + 1) await rebuildLaunchArea(ctx, chain, stepPx);

    // Re-measure the chain precisely (detection positions are coarse).
    const refined: TrackedMark[] = [];
    for (let i = 0; i < chain.length; i++) {
      const p = chain[i];
      const a = chain[Math.max(0, i - 1)];
      const b = chain[Math.min(chain.length - 1, i + 1)];
      const span = Math.max(1, b.frameNumber - a.frameNumber);
      const motion = { du: (b.u - a.u) / span, dv: (b.v - a.v) / span };
      const out = await measureAt(ctx, p.frameNumber, { u: p.u, v: p.v, gatePx: 2 + 0.3 * stepPx + ctx.diff.detectScale, speedPx: stepPx, ...motion }, 0);
      if (out.kind === 'mark') refined.push(out.mark);
    }
    if (refined.length < 3) return { marks: [], launchFrame: null, endReason: 'lost' };
    ctx.radiusPx = Math.max(1, Math.sqrt(median(refined.map((m) => m.coverage)) / Math.PI));
    for (const m of refined) await ctx.emit(m);

    const back = await follow(ctx, refined, -1);
    const history = [...back.added, ...refined];
    const fwd = await follow(ctx, history, 1);

    const marks = [...decided.values()].sort((a, b) => a.frameNumber - b.frameNumber).map(publicMark);
    const first = marks[0]?.frameNumber ?? null;
    const launched = back.endReason === 'rest' || ((found.bornInside || !!seed) && back.endReason === 'lost');
    options.onProgress?.(1);
    return { marks, launchFrame: launched && first !== null && first > from ? first : null, endReason: fwd.endReason === 'rest' ? 'lost' : fwd.endReason };
  } finally {
    diff.dispose();
  }
}

function publicMark(m: TrackedMark): AutoMark {
  return { frameNumber: m.frameNumber, uPx: m.uPx, vPx: m.vPx, confidence: m.confidence, reason: m.reason };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[s.length >> 1] : 0;
}

function majorityPolarity(blobs: Blob[]): 1 | -1 {
  return blobs.filter((b) => b.polarity === 1).length * 2 >= blobs.length ? 1 : -1;
}

/**
 * The background around the launch point, rebuilt from frames where the
 * projectile has flown well clear of it (predicted from the chain).
 */
async function rebuildLaunchArea(ctx: TrackContext, chain: ChainPoint[], stepPx: number) {
  const c = chain[0];
  const half = 3 * stepPx + 4 * ctx.radiusPx + 8;
  const clear = half + 3 * ctx.radiusPx + stepPx;
  const picks: number[] = [];
  for (let f = chain[chain.length - 1].frameNumber + 1; f <= ctx.to && picks.length < 7; f++) {
    const p = predictAt(chain, f);
    if (Math.hypot(p.u - c.u, p.v - c.v) > clear) picks.push(f);
  }
  if (picks.length < 3) return;
  await patchBackground(ctx.model, ctx.store, picks, { x: c.u - half, y: c.v - half, width: 2 * half, height: 2 * half });
  ctx.diff.refreshBackground();
}

/**
 * From a click: the blob under it, and the blobs one and two frames on (or
 * back) that continue it at a steady velocity.
 */
async function startFromSeed(ctx: TrackContext, seed: AutoMarkSeed): Promise<FoundProjectile | null> {
  const W = ctx.store.width;
  const H = ctx.store.height;
  const maxArea = 0.005 * W * H;
  const blobsAt = new Map<number, Blob[]>();
  for (let f = Math.max(ctx.from, seed.frameNumber - 2); f <= Math.min(ctx.to, seed.frameNumber + 2); f++) {
    const { frame, gain } = await gainFor(ctx, f);
    ctx.diff.setFrame(frame, gain);
    blobsAt.set(f, ctx.diff.detectAll(2, maxArea));
  }
  const s = seed.frameNumber;
  const clicked = (blobsAt.get(s) ?? [])
    .map((b) => ({ b, d: Math.hypot(b.u - seed.uPx, b.v - seed.vPx) }))
    .filter((x) => x.d <= 15)
    .sort((x, y) => x.d - y.d)[0]?.b;
  if (!clicked) return null;
  const pt = (f: number, b: Blob): ChainPoint => ({ frameNumber: f, u: b.u, v: b.v, blob: b });
  const maxStep = 0.25 * Math.max(W, H);
  // Triples (s, s+1, s+2), (s-1, s, s+1), (s-2, s-1, s): the seed first, middle, last.
  for (const offsets of [[0, 1, 2], [-1, 0, 1], [-2, -1, 0]]) {
    const fs = offsets.map((o) => s + o);
    if (fs.some((f) => !blobsAt.has(f))) continue;
    const k = offsets.indexOf(0);
    const at = (i: number) => (i === k ? [clicked] : blobsAt.get(fs[i])!.filter((b) => b.polarity === clicked.polarity));
    let best: { pts: ChainPoint[]; err: number } | null = null;
    for (const a of at(0)) {
      for (const b of at(1)) {
        const step = Math.hypot(b.u - a.u, b.v - a.v);
        if (step < 1 || step > maxStep) continue;
        for (const c of at(2)) {
          const err = Math.hypot(c.u - (2 * b.u - a.u), c.v - (2 * b.v - a.v));
          if (err > 2 + 0.2 * step) continue;
          if (!best || err < best.err) best = { pts: [pt(fs[0], a), pt(fs[1], b), pt(fs[2], c)], err };
        }
      }
    }
    if (best) return { chain: best.pts, bornInside: false };
  }
  return null;
}
