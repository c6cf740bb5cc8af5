// Upload a generated clip, watch it extract on the real job queue, read its
// frames. The reference for every time is the generator's truth file: a
// constant-rate clip's frame i was rendered at exactly i / captureFps.
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords';
import { clips } from '../../server/db/schema/clips';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { ClipFrameView, ClipView } from '../../shared/schemas/clips';
import { createShot, demoTeamId, fixtureDir, scratchFiles, storedKeys, tempStorageDir, uploadClip, waitForClip } from '../support/clips';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';
import { eq } from 'drizzle-orm';

const suffix = uniqueSuffix();
let t: TestApp;
let teamId: string;
let shotId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let viewer: Awaited<ReturnType<typeof signInAs>>;
let outsider: Awaited<ReturnType<typeof signInAs>>;
let clean: GeneratedClip;
let storageDir: string;

beforeAll(async () => {
  storageDir = tempStorageDir('upload');
  t = await createTestApp({ storageDir, jobSchema: `pgboss_up_${suffix}`, signInLimitPerWindow: 1000 }, {}, { jobs: 'worker' });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
  clean = await generatePreset('clean', fixtureDir('upload'));
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  // A member of another team only.
  const email = `outsider-${suffix}@elsewhere.test`;
  const [user] = await t.deps.db.insert(users).values({ email, displayName: 'Outside Analyst', passwordHash: await hashPassword(DEMO_PASSWORD) }).returning();
  const [team] = await t.deps.db.insert(teams).values({ name: `Other team ${suffix}`, slug: `other-${suffix}` }).returning();
  await t.deps.db.insert(memberships).values({ teamId: team.id, userId: user.id, role: 'admin' });
  outsider = await signInAs(t.app, email, DEMO_PASSWORD);
}, 180_000);
afterAll(() => t.close());

let clip: ClipView;

describe('upload and extraction', () => {
  it('accepts a clip, states its time base and queues extraction', async () => {
    const res = await uploadClip(analyst, teamId, shotId, clean.videoPath, { captureFps: 240 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    clip = res.body;
    expect(clip).toMatchObject({
      shotId,
      originalName: path.basename(clean.videoPath),
      codec: 'h264',
      width: 640,
      height: 360,
      rotationDeg: 0,
      containerFps: 240,
      captureFps: 240,
      frameCount: clean.truth.frameCount,
      variableFrameRate: false,
      inFrame: 0,
      outFrame: clean.truth.frameCount - 1,
      duplicateOf: null,
    });
    expect(['queued', 'extracting', 'ready']).toContain(clip.status);
    expect(clip.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(clip.warnings).toEqual([]);
  });

  it('extracts every frame; times match the truth file', async () => {
    const ready = await waitForClip(analyst, teamId, clip.id);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.progress).toBe(1);
    expect(ready.extractedCount).toBe(clean.truth.frameCount);
    const res = await analyst.get(`/api/teams/${teamId}/clips/${clip.id}/frames`);
    expect(res.status).toBe(200);
    const frames = res.body as ClipFrameView[];
    expect(frames.map((f) => f.frameNumber)).toEqual(clean.truth.frames.map((f) => f.frameNumber));
    for (const f of frames) {
      // Truth: frame i at i / 240 s (the generator's clock).
      expect(f.tS).toBeCloseTo(clean.truth.frames[f.frameNumber].tS, 9);
      expect(f.flag).toBeNull();
    }
  });

  it('serves a frame as JPEG of the clip size with a strong ETag and immutable caching; 304 when unchanged', async () => {
    const url = `/api/teams/${teamId}/clips/${clip.id}/frames/10/image`;
    const res = await viewer.get(url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['cache-control']).toBe('private, max-age=31536000, immutable');
    const etag = res.headers.etag;
    expect(etag).toMatch(/^"[^"]+"$/); // strong: no W/ prefix (RFC 9110 §8.8.3)
    const meta = await sharp(res.body as Buffer).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', 640, 360]);
    const again = await viewer.get(url).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    const other = await viewer.get(url).set('If-None-Match', '"something-else"');
    expect(other.status).toBe(200);
  });

  it('serves the thumbnail strip', async () => {
    const ready = await waitForClip(analyst, teamId, clip.id);
    expect(ready.thumbnailCount).toBeGreaterThan(1);
    const res = await viewer.get(`/api/teams/${teamId}/clips/${clip.id}/thumbnails/0/image`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expectProblem(await viewer.get(`/api/teams/${teamId}/clips/${clip.id}/thumbnails/${ready.thumbnailCount}/image`), 404);
  });

  it('lists the shot’s clips', async () => {
    const res = await viewer.get(`/api/teams/${teamId}/shots/${shotId}/clips`);
    expect(res.status).toBe(200);
    expect(res.body.map((c: ClipView) => c.id)).toContain(clip.id);
  });

  it('accepts the same file again but says it is a duplicate', async () => {
    const res = await uploadClip(analyst, teamId, shotId, clean.videoPath, { captureFps: 240 });
    expect(res.status).toBe(201);
    expect(res.body.duplicateOf).toMatchObject({ clipId: clip.id, shotId });
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('duplicate-upload');
    const ready = await waitForClip(analyst, teamId, res.body.id);
    expect(ready.status).toBe('ready');
  });
});

describe('who may see and change clips', () => {
  it('a member of another team gets 403 for the clip, its frames and its images', async () => {
    for (const url of [
      `/api/teams/${teamId}/clips/${clip.id}`,
      `/api/teams/${teamId}/clips/${clip.id}/frames`,
      `/api/teams/${teamId}/clips/${clip.id}/frames/0/image`,
      `/api/teams/${teamId}/clips/${clip.id}/thumbnails/0/image`,
    ]) {
      expectProblem(await outsider.get(url), 403);
    }
  });

  it('signed out gets 401 for a frame image', async () => {
    expectProblem(await request(t.app).get(`/api/teams/${teamId}/clips/${clip.id}/frames/0/image`), 401);
  });

  it('a viewer may read but not upload', async () => {
    const res = await uploadClip(viewer, teamId, shotId, clean.videoPath, { captureFps: 240 });
    expectProblem(res, 403);
  });

  it('a member of another team cannot upload here (403); an unknown shot is 404', async () => {
    expectProblem(await uploadClip(outsider, teamId, shotId, clean.videoPath, { captureFps: 240 }), 403);
    expectProblem(await uploadClip(analyst, teamId, '00000000-0000-4000-8000-000000000000', clean.videoPath, { captureFps: 240 }), 404);
  });
});

describe('changing a clip', () => {
  it('a new capture rate rescales every time without re-extracting', async () => {
    const res = await analyst.patch(`/api/teams/${teamId}/clips/${clip.id}`).send({ captureFps: 120 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.status).toBe('ready');
    expect(res.body.warnings.map((w: { code: string; message: string }) => w.message)).toEqual([
      'Plays at 240 fps but was captured at 120 fps: times use 120 fps.',
    ]);
    const frames = (await analyst.get(`/api/teams/${teamId}/clips/${clip.id}/frames`)).body as ClipFrameView[];
    expect(frames[30].tS).toBeCloseTo(30 / 120, 12);
  });

  it('a new range re-extracts only those frames', async () => {
    const res = await analyst.patch(`/api/teams/${teamId}/clips/${clip.id}`).send({ captureFps: 240, inFrame: 10, outFrame: 19 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const ready = await waitForClip(analyst, teamId, clip.id, (c) => c.status === 'ready' && c.inFrame === 10 && c.extractedCount === 10);
    expect(ready.outFrame).toBe(19);
    const frames = (await analyst.get(`/api/teams/${teamId}/clips/${clip.id}/frames`)).body as ClipFrameView[];
    expect(frames.map((f) => f.frameNumber)).toEqual([10, 11, 12, 13, 14, 15, 16, 17, 18, 19]);
    expect(frames[0].tS).toBeCloseTo(10 / 240, 12);
    expectProblem(await analyst.get(`/api/teams/${teamId}/clips/${clip.id}/frames/9/image`), 404);
    // Only the current frame set is kept in storage: the old one goes right after the swap (a moment later on an object store).
    const versions = async () => new Set((await storedKeys(t)).filter((f) => f.includes(`/clips/${clip.id}/v-`)).map((f) => f.split('/v-')[1].split('/')[0]));
    for (let i = 0; i < 50 && (await versions()).size > 1; i++) await new Promise((r) => setTimeout(r, 100));
    expect((await versions()).size).toBe(1);
  });

  it('rejects a range outside the clip', async () => {
    const res = await analyst.patch(`/api/teams/${teamId}/clips/${clip.id}`).send({ outFrame: 5000 });
    expectProblem(res, 400);
    expect(res.body.detail).toMatch(/has 60 frames/);
  });

  it('re-extracts on request; cancel of a ready clip is a conflict', async () => {
    const res = await analyst.post(`/api/teams/${teamId}/clips/${clip.id}/extract`);
    expect(res.status).toBe(202);
    const ready = await waitForClip(analyst, teamId, clip.id);
    expect(ready.status).toBe('ready');
    expectProblem(await analyst.post(`/api/teams/${teamId}/clips/${clip.id}/cancel`), 409);
  });

  it('delete removes the row, the frames and the files', async () => {
    const res = await analyst.delete(`/api/teams/${teamId}/clips/${clip.id}`);
    expect(res.status).toBe(204);
    expect(await t.deps.db.select().from(clips).where(eq(clips.id, clip.id))).toEqual([]);
    expect((await storedKeys(t)).filter((f) => f.includes(clip.id))).toEqual([]);
    expectProblem(await analyst.get(`/api/teams/${teamId}/clips/${clip.id}`), 404);
  });
});

describe('cancelling an extraction', () => {
  it('stops the job, keeps no frames, and a re-extract afterwards completes', async () => {
    const long = await generatePreset('clean', fixtureDir('cancel'), { name: 'cancel-me', frameCount: 900, noiseSigma: 0, x264Preset: 'ultrafast', crf: 24 });
    const up = await uploadClip(analyst, teamId, shotId, long.videoPath, { captureFps: 240 });
    expect(up.status).toBe(201);
    const cancelled = await analyst.post(`/api/teams/${teamId}/clips/${up.body.id}/cancel`);
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(200);
    expect(cancelled.body.status).toBe('cancelled');
    // A run that had started notices within a heartbeat and removes its scratch folder on the way out.
    const scratch = () => scratchFiles(t).filter((f) => f.includes(up.body.id));
    for (let i = 0; i < 200 && scratch().length > 0; i++) await new Promise((r) => setTimeout(r, 100));
    await new Promise((r) => setTimeout(r, 1500));
    expect(scratch()).toEqual([]);
    const after = (await analyst.get(`/api/teams/${teamId}/clips/${up.body.id}`)).body as ClipView;
    expect(after.status).toBe('cancelled');
    expect((await analyst.get(`/api/teams/${teamId}/clips/${up.body.id}/frames`)).body).toEqual([]);
    expect((await storedKeys(t)).filter((f) => f.includes(`/clips/${up.body.id}/v-`))).toEqual([]);

    expect((await analyst.post(`/api/teams/${teamId}/clips/${up.body.id}/extract`)).status).toBe(202);
    const ready = await waitForClip(analyst, teamId, up.body.id);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.extractedCount).toBe(900);
  }, 240_000);
});
