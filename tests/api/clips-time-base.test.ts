// Time base through the whole pipeline (upload → ffprobe → extraction job),
// checked against the generator's truth files: slow-motion files play slower
// than they were captured, variable-rate files carry their own timestamps,
// rotated files are served upright.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generatePreset, type ClipTruth } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { ClipFrameView, ClipView } from '../../shared/schemas/clips';
import { createShot, demoTeamId, fixtureDir, tempStorageDir, uploadClip, waitForClip } from '../support/clips';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const suffix = uniqueSuffix();
let t: TestApp;
let teamId: string;
let shotId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let fixtures: string;

beforeAll(async () => {
  t = await createTestApp({ storageDir: tempStorageDir('timebase'), jobSchema: `pgboss_tb_${suffix}` }, {}, { jobs: 'worker' });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  fixtures = fixtureDir('timebase');
}, 120_000);
afterAll(() => t.close());

async function uploadAndExtract(preset: 'slowmo' | 'vfr' | 'rotated' | 'blur-roll', captureFps: number) {
  const clip = await generatePreset(preset, fixtures);
  const res = await uploadClip(analyst, teamId, shotId, clip.videoPath, { captureFps });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const ready = await waitForClip(analyst, teamId, res.body.id);
  expect(ready.status, ready.error ?? '').toBe('ready');
  const frames = (await analyst.get(`/api/teams/${teamId}/clips/${ready.id}/frames`)).body as ClipFrameView[];
  return { truth: clip.truth, clip: ready, frames };
}

function expectTimesMatch(frames: ClipFrameView[], truth: ClipTruth, tolS: number) {
  expect(frames.map((f) => f.frameNumber)).toEqual(truth.frames.map((f) => f.frameNumber));
  const worst = Math.max(...frames.map((f) => Math.abs(f.tS - truth.frames[f.frameNumber].tS)));
  expect(worst).toBeLessThan(tolS);
}

/** Centroid of darkness (below the wall's gray) in a window around a point of the served frame. */
async function discCentroid(jpeg: Buffer, near: { u: number; v: number }, radius = 8) {
  const { data, info } = await sharp(jpeg).greyscale().raw().toBuffer({ resolveWithObject: true });
  let w = 0;
  let su = 0;
  let sv = 0;
  for (let y = Math.floor(near.v - radius); y <= Math.ceil(near.v + radius); y++) {
    for (let x = Math.floor(near.u - radius); x <= Math.ceil(near.u + radius); x++) {
      const dark = Math.max(0, 190 - data[y * info.width + x]);
      w += dark;
      su += dark * (x + 0.5);
      sv += dark * (y + 0.5);
    }
  }
  return { width: info.width, height: info.height, u: su / w, v: sv / w };
}

describe('time base', () => {
  it('slow motion: plays at 30 fps, captured at 240; times use 240 and a warning says so', async () => {
    const { clip, frames, truth } = await uploadAndExtract('slowmo', 240);
    expect(clip.containerFps).toBe(30);
    expect(clip.captureFps).toBe(240);
    expect(clip.warnings).toContainEqual({ code: 'rate-differs', message: 'Plays at 30 fps but was captured at 240 fps: times use 240 fps.' });
    // Truth: frame i at i / 240 s, not i / 30 s.
    expectTimesMatch(frames, truth, 1e-9);
    expect(frames[59].tS).toBeCloseTo(59 / 240, 12);
    expect(frames[59].ptsS).toBeCloseTo(59 / 30, 5);
  });

  it('variable frame rate: times come from each frame’s timestamp; the missing frame is flagged', async () => {
    const { clip, frames, truth } = await uploadAndExtract('vfr', 120);
    expect(clip.variableFrameRate).toBe(true);
    expect(clip.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['variable-frame-rate', 'dropped-frames']));
    // Timestamps are written on a 1/90000 s clock, so each time is within one tick of the truth.
    expectTimesMatch(frames, truth, 1 / 90000 + 1e-9);
    const flagged = frames.filter((f) => f.flag).map((f) => [f.frameNumber, f.flag]);
    expect(flagged).toEqual([[20, 'dropped-before']]);
  });

  it('rotated: the file is stored sideways and served upright, the disc where the truth says', async () => {
    const { clip, truth } = await uploadAndExtract('rotated', 120);
    expect([clip.width, clip.height]).toEqual([360, 640]);
    expect([clip.frameWidth, clip.frameHeight]).toEqual([640, 360]);
    expect([90, 270]).toContain(clip.rotationDeg);
    const k = 25;
    const res = await analyst
      .get(`/api/teams/${teamId}/clips/${clip.id}/frames/${k}/image`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    const c = await discCentroid(res.body as Buffer, { u: truth.frames[k].uPx, v: truth.frames[k].vPx });
    expect([c.width, c.height]).toEqual([640, 360]);
    // A frame turned the wrong way would put the disc hundreds of pixels off.
    expect(Math.hypot(c.u - truth.frames[k].uPx, c.v - truth.frames[k].vPx)).toBeLessThan(0.5);
  });

  it('motion blur and camera roll: every frame extracted at the capture clock', async () => {
    const { clip, frames, truth } = await uploadAndExtract('blur-roll', 240);
    expect((clip as ClipView).warnings).toEqual([]);
    expectTimesMatch(frames, truth, 1e-9);
  });
});
