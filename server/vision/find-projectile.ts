// Finding the projectile with no click. Each frame's difference from the
// background gives compact blobs; a blob that sits still from frame to frame
// (a ball resting in the muzzle, a flickering lamp) is static and ignored.
// Three frames of moving blobs in near-constant velocity start a candidate
// chain; chains that keep going ballistically for six frames are judged:
// the projectile's chain starts near the launch point (the calibration origin
// when known) or, without a hint, is born inside the picture (launched there),
// where a bird or a passer-by enters from an edge or is there from the start.
import { throwIfAborted } from './frame-store';
import { quadraticScatterPx, type TrackPoint } from './motion-model';
import type { Blob } from './scene-diff';
import { gainFor, type TrackContext } from './track-follower';

export interface ChainPoint extends TrackPoint {
  blob: Blob;
}

export interface FoundProjectile {
  chain: ChainPoint[];
  /** The first frame of the chain (after extending it backward) follows a frame without it, inside the picture. */
  bornInside: boolean;
}

interface Hypothesis {
  points: ChainPoint[];
}

interface FrameBlobs {
  moving: Blob[];
  all: Blob[];
}

const MIN_STEP_PX = 1.5;
const CONFIRM_POINTS = 6;
const MAX_HYPOTHESES = 300;

function nearest(blobs: Blob[], u: number, v: number, tol: number, polarity?: 1 | -1): Blob | null {
  let best: Blob | null = null;
  let bestD = tol;
  for (const b of blobs) {
    if (polarity !== undefined && b.polarity !== polarity) continue;
    const d = Math.hypot(b.u - u, b.v - v);
    if (d <= bestD) {
      best = b;
      bestD = d;
    }
  }
  return best;
}

function next(points: ChainPoint[], direction: 1 | -1) {
  const ordered = direction === 1 ? points.slice(-3).reverse() : points.slice(0, 3);
  const [a, b, c] = ordered;
  const speed = Math.hypot(a.u - b.u, a.v - b.v);
  if (!c) return { u: 2 * a.u - b.u, v: 2 * a.v - b.v, tol: 2 + 0.25 * speed };
  return { u: 3 * a.u - 3 * b.u + c.u, v: 3 * a.v - 3 * b.v + c.v, tol: 2 + 0.15 * speed };
}

export async function findProjectile(ctx: TrackContext, originHint: { uPx: number; vPx: number } | null): Promise<FoundProjectile | null> {
  const W = ctx.store.width;
  const H = ctx.store.height;
  const maxStep = 0.25 * Math.max(W, H);
  const maxArea = 0.005 * W * H;
  const seen = new Map<number, FrameBlobs>();
  let active: Hypothesis[] = [];
  let fallback: Hypothesis | null = null;

  const judge = (h: Hypothesis): FoundProjectile | 'reject' | 'fallback' => {
    if (quadraticScatterPx(h.points) > 1.2) return 'reject';
    // Extend backward through frames already seen: where was it born?
    const chain = [...h.points];
    for (let f = chain[0].frameNumber - 1; f >= ctx.from; f--) {
      const p = next(chain, -1);
      const b = nearest(seen.get(f)?.moving ?? [], p.u, p.v, p.tol, chain[0].blob.polarity);
      if (!b) break;
      chain.unshift({ frameNumber: f, u: b.u, v: b.v, blob: b });
    }
    const before = next(chain, -1);
    const margin = 6;
    const bornInside = chain[0].frameNumber > ctx.from && before.u > margin && before.v > margin && before.u < W - margin && before.v < H - margin;
    const step = Math.hypot(chain[1].u - chain[0].u, chain[1].v - chain[0].v);
    if (originHint) {
      // Moving away from the launch point, and starting near it (allowing for a few frames the launcher hid it).
      const d0 = Math.hypot(chain[0].u - originHint.uPx, chain[0].v - originHint.vPx);
      const d1 = Math.hypot(chain[chain.length - 1].u - originHint.uPx, chain[chain.length - 1].v - originHint.vPx);
      const nearOrigin = d0 <= Math.max(30, 6 * step) && d1 > d0;
      return nearOrigin ? { chain, bornInside } : 'fallback';
    }
    return bornInside ? { chain, bornInside } : 'fallback';
  };

  for (let f = ctx.from; f <= ctx.to; f++) {
    throwIfAborted(ctx.signal);
    const { frame, gain } = await gainFor(ctx, f);
    ctx.diff.setFrame(frame, gain);
    const all = ctx.diff.detectAll(3, maxArea);
    const prev = seen.get(f - 1);
    // Static: a blob of the previous frame within a pixel (a resting ball, a lamp, a flickering edge).
    const moving = all.filter((b) => !prev?.all.some((q) => Math.hypot(q.u - b.u, q.v - b.v) < 1 + 0.5 * ctx.diff.detectScale));
    seen.set(f, { moving, all });
    seen.delete(f - 40);
    ctx.progress(f);

    const survivors: Hypothesis[] = [];
    for (const h of active) {
      const p = next(h.points, 1);
      const b = nearest(moving, p.u, p.v, p.tol, h.points[0].blob.polarity);
      if (!b) {
        if (h.points.length >= CONFIRM_POINTS && (!fallback || h.points.length > fallback.points.length)) fallback = h;
        continue;
      }
      h.points.push({ frameNumber: f, u: b.u, v: b.v, blob: b });
      if (h.points.length === CONFIRM_POINTS) {
        const verdict = judge(h);
        if (verdict === 'reject') continue;
        if (verdict !== 'fallback') return verdict;
      }
      survivors.push(h);
    }
    active = survivors;

    const a = seen.get(f - 2)?.moving ?? [];
    const b = prev?.moving ?? [];
    const alike = (x: Blob, y: Blob) => Math.max(x.area, y.area) <= 3 * Math.min(x.area, y.area) && Math.max(x.peak, y.peak) <= 3 * Math.min(x.peak, y.peak);
    const fresh: { h: Hypothesis; err: number }[] = [];
    for (const pa of a) {
      for (const pb of b) {
        if (pb.polarity !== pa.polarity || !alike(pa, pb)) continue;
        const step = Math.hypot(pb.u - pa.u, pb.v - pa.v);
        if (step < MIN_STEP_PX || step > maxStep) continue;
        const cu = 2 * pb.u - pa.u;
        const cv = 2 * pb.v - pa.v;
        const pc = nearest(moving, cu, cv, 2 + 0.2 * step, pa.polarity);
        if (!pc || !alike(pb, pc)) continue;
        if (active.some((h) => h.points.some((q) => q.blob === pc) && h.points.some((q) => q.blob === pb))) continue;
        fresh.push({
          err: Math.hypot(pc.u - cu, pc.v - cv) / (1 + 0.2 * step),
          h: {
            points: [
              { frameNumber: f - 2, u: pa.u, v: pa.v, blob: pa },
              { frameNumber: f - 1, u: pb.u, v: pb.v, blob: pb },
              { frameNumber: f, u: pc.u, v: pc.v, blob: pc },
            ],
          },
        });
      }
    }
    // Most consistent first; in a busy frame the worst guesses are the ones left out.
    fresh.sort((x, y) => x.err - y.err);
    for (const { h } of fresh.slice(0, Math.max(0, MAX_HYPOTHESES - active.length))) active.push(h);
  }
  for (const h of active) if (h.points.length >= CONFIRM_POINTS && (!fallback || h.points.length > fallback.points.length)) fallback = h;
  if (!fallback) return null;
  return { chain: fallback.points, bornInside: false };
}
