// TEMPORARY stand-in for server/vision/auto-mark-track.ts (H-vision) with the
// same contract, so the job and API can be exercised before the real tracker
// lands. Dark object against a per-pixel maximum background; no physics.
export interface GrayFrame { frameNumber: number; width: number; height: number; data: Uint8Array }
export interface FrameSource { frameCount: number; width: number; height: number; read(frameNumber: number): Promise<GrayFrame> }
export interface AutoMarkSeed { frameNumber: number; uPx: number; vPx: number }
export interface AutoMark { frameNumber: number; uPx: number; vPx: number; confidence: number; reason: string | null }
export interface AutoMarkOptions {
  seed?: AutoMarkSeed;
  originHint?: { uPx: number; vPx: number } | null;
  fromFrame?: number;
  toFrame?: number;
  signal?: AbortSignal;
  onProgress?: (fraction: number) => void;
  onMark?: (mark: AutoMark) => void | Promise<void>;
}
export interface AutoMarkOutcome { marks: AutoMark[]; launchFrame: number | null; endReason: 'left-frame' | 'lost' | 'end-of-clip' }

export async function autoMarkTrack(frames: FrameSource, options: AutoMarkOptions = {}): Promise<AutoMarkOutcome> {
  const from = options.fromFrame ?? 0;
  const to = options.toFrame ?? frames.frameCount - 1;
  const bg = new Uint8Array(frames.width * frames.height);
  for (let i = 0; i < 8; i++) {
    const f = await frames.read(Math.round(from + ((to - from) * i) / 7));
    for (let p = 0; p < bg.length; p++) if (f.data[p] > bg[p]) bg[p] = f.data[p];
  }
  const marks: AutoMark[] = [];
  for (let n = from; n <= to; n++) {
    if (options.signal?.aborted) throw Object.assign(new Error('aborted'), { name: 'AbortError' });
    const f = await frames.read(n);
    let sw = 0, su = 0, sv = 0, peak = 0;
    for (let v = 0; v < f.height; v++) for (let u = 0; u < f.width; u++) {
      const d = bg[v * f.width + u] - f.data[v * f.width + u];
      if (d > 40) { sw += d; su += d * u; sv += d * v; if (d > peak) peak = d; }
    }
    if (sw > 0) {
      const mark = { frameNumber: n, uPx: su / sw, vPx: sv / sw, confidence: Math.min(1, peak / 120), reason: peak < 72 ? 'weak contrast' : null };
      marks.push(mark);
      await options.onMark?.(mark);
    }
    options.onProgress?.((n - from + 1) / (to - from + 1));
  }
  return { marks, launchFrame: marks[0]?.frameNumber ?? null, endReason: 'end-of-clip' };
}
