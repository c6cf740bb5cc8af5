// Auto-marking speed on a 1280×720, 300-frame clip, as a ratio against only
// decoding the same frames (the JPEGs the extraction job writes, decoded to
// luma by sharp, as the auto-mark job reads them). Goals from the issue:
// within 3× the decode time and 10 s or less per 300 frames on 2 cores.
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { generatePreset } from '../server/fixtures/clip-generator';
import { autoMarkTrack } from '../server/vision/auto-mark-track';
import { loadOpenCv } from '../server/vision/opencv';
import { extractClipFrames, jpegFrameSource } from '../server/vision/test-support/clip-frames';

const FRAMES = 300;
const ROUNDS = 3;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timed(fn: () => Promise<unknown>): Promise<number> {
  const start = performance.now();
  await fn();
  return (performance.now() - start) / 1000;
}

export async function benchAutomark(): Promise<string> {
  const work = await mkdtemp(path.join(process.env.ARCBENCH_TMP ?? os.tmpdir(), 'bench-automark-'));
  try {
    // A 14 m/s lob at 45° across a 1280×720 field at 100 px/m, resting 20 frames first, with clutter and flicker.
    const clip = await generatePreset('field-clutter', path.join(work, 'clip'), {
      name: 'bench-automark',
      width: 1280,
      height: 720,
      frameCount: FRAMES,
      pixelsPerMetre: 100,
      diameterM: 0.08,
      launchSpeedMps: 14,
      launchAngleDeg: 45,
      originPx: { u: 110, v: 600 },
      scene: {
        launcher: true,
        restFrames: 20,
        foliage: [{ u0: 900, v0: 560, u1: 1280, v1: 680 }],
        backPosts: [{ u: 640, widthPx: 14, topV: 300 }],
        flicker: { mainsHz: 50, depth: 0.08 },
        vignette: 0.3,
      },
    });
    const framesDir = await extractClipFrames(clip, path.join(work, 'frames'));
    const { width, height } = clip.truth;
    const source = jpegFrameSource(framesDir, FRAMES, width, height);

    const loadS = await timed(() => loadOpenCv());
    const decode = async () => {
      for (let n = 0; n < FRAMES; n++) await source.read(n);
    };
    let marks = 0;
    const mark = async () => {
      const out = await autoMarkTrack(source);
      marks = out.marks.length;
    };
    // Untimed warm-up of both (page cache, sharp's and OpenCV's first-call costs), then interleaved rounds.
    await decode();
    await mark();
    const decodeS: number[] = [];
    const markS: number[] = [];
    for (let r = 0; r < ROUNDS; r++) {
      decodeS.push(await timed(decode));
      markS.push(await timed(mark));
    }
    const d = median(decodeS);
    const m = median(markS);
    const inFlight = clip.truth.frames.filter((f) => f.inFlight && f.visibility === 'visible').length;
    return [
      `auto-marking ${FRAMES} frames of ${width}×${height} (JPEG frames decoded by sharp), median of ${ROUNDS}:`,
      `  decoding only:        ${d.toFixed(2)} s (${((1000 * d) / FRAMES).toFixed(1)} ms/frame)`,
      `  auto-marking:         ${m.toFixed(2)} s (${((1000 * m) / FRAMES).toFixed(1)} ms/frame, decoding included)   ratio ${(m / d).toFixed(2)} (target ≤ 3)`,
      `  per 300 frames:       ${((m * 300) / FRAMES).toFixed(2)} s (target ≤ 10 s on 2 cores)`,
      `  marks: ${marks} of ${inFlight} frames with the ball visible in flight; OpenCV load once per process: ${loadS.toFixed(2)} s (not in the times above)`,
    ].join('\n');
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
