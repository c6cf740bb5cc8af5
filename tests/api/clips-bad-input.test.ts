// Every bad upload gets a clear 4xx problem+json, the server keeps serving, and
// nothing of the rejected file stays behind: no clip row, no temp file, no object.
import { readFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { clips } from '../../server/db/schema/clips';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { encodeRawFrames, remux } from '../../server/media/ffmpeg';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { createShot, demoTeamId, filesUnder, fixtureDir, tempStorageDir, unownedClipKeys, uploadClip } from '../support/clips';
import { s3Run } from '../support/api-s3-run';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const LIMIT_BYTES = 256 * 1024;
const suffix = uniqueSuffix();
let t: TestApp;
let teamId: string;
let shotId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let storageDir: string;
let fixtures: string;
let clean: GeneratedClip;

async function tinyClip(name: string, width: number, height: number): Promise<string> {
  const file = path.join(fixtures, name);
  const enc = encodeRawFrames({ outFile: file, width, height, pixFmt: 'gray', fps: 30, outputArgs: ['-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p'] });
  for (let i = 0; i < 3; i++) await enc.write(Buffer.alloc(width * height, 100 + i * 20));
  await enc.finish();
  return file;
}

beforeAll(async () => {
  storageDir = tempStorageDir('bad');
  fixtures = fixtureDir('bad');
  t = await createTestApp({ storageDir, uploadLimitBytes: LIMIT_BYTES });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  clean = await generatePreset('clean', fixtures, { frameCount: 24 });
}, 180_000);
afterAll(() => t.close());

/** What a rejected upload could leave: files in the local storage folder; in the S3 run also objects no clip owns. */
async function leftovers(): Promise<string[]> {
  return [...filesUnder(storageDir), ...(s3Run() ? await unownedClipKeys(t, teamId) : [])];
}

/** Nothing of a rejected upload may remain. The object goes when the response ends, so allow the close handler a moment. */
async function expectNothingLeft() {
  for (let i = 0; i < 50 && (await leftovers()).length > 0; i++) await new Promise((r) => setTimeout(r, 100));
  expect(await leftovers()).toEqual([]);
  expect(await t.deps.db.select({ id: clips.id }).from(clips).where(eq(clips.shotId, shotId))).toEqual([]);
}

afterEach(async () => {
  await expectNothingLeft();
  // The server is still up and answering.
  expect((await analyst.get('/api/auth/me')).status).toBe(200);
});

/** The app on a real port, and a session cookie of the analyst, for hand-made requests. */
async function listen() {
  const server = http.createServer(t.app).listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  const signIn = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Arcbench-Request': '1' },
    body: JSON.stringify({ email: demoPerson('analyst').email, password: DEMO_PASSWORD }),
  });
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  return { port, cookie, close: () => new Promise((r) => server.close(r)) };
}

describe('rejected uploads', () => {
  it('zero bytes → 400', async () => {
    const res = await uploadClip(analyst, teamId, shotId, { buffer: Buffer.alloc(0), name: 'empty.mp4' });
    expectProblem(res, 400);
    expect(res.body.detail).toMatch(/empty/);
  });

  it('a text file renamed .mp4 → 415 (the bytes decide, not the name)', async () => {
    const res = await uploadClip(analyst, teamId, shotId, { buffer: Buffer.from('shot 4, 600 kPa, 23 degrees\n'.repeat(200)), name: 'notes.mp4' });
    expectProblem(res, 415);
    expect(res.body.detail).toMatch(/not a video/);
  });

  it('a PNG → 415 naming what it is', async () => {
    const png = await sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 200, g: 190, b: 170 } } }).png().toBuffer();
    const res = await uploadClip(analyst, teamId, shotId, { buffer: png, name: 'frame.png' });
    expectProblem(res, 415);
    expect(res.body.detail).toMatch(/image\/png/);
  });

  it('an MP4 cut short before its index → 422', async () => {
    // The generator writes the index (moov) first; a plain remux puts it at the end, so a cut loses it.
    const late = path.join(fixtures, 'index-at-end.mp4');
    await remux(clean.videoPath, late, []);
    const bytes = readFileSync(late);
    const res = await uploadClip(analyst, teamId, shotId, { buffer: bytes.subarray(0, Math.floor(bytes.length * 0.6)), name: 'cut.mp4' });
    expectProblem(res, 422);
    expect(res.body.detail).toMatch(/cannot be read as video/);
  });

  it('an MP4 whose frames are cut off after a complete index → 422 truncated', async () => {
    const bytes = readFileSync(clean.videoPath);
    const res = await uploadClip(analyst, teamId, shotId, { buffer: bytes.subarray(0, Math.floor(bytes.length * 0.5)), name: 'half.mp4' });
    expectProblem(res, 422);
    expect(res.body.detail).toMatch(/truncated|cannot be read/);
  });

  it('a file over the upload limit → 413', async () => {
    const big = Buffer.concat([readFileSync(clean.videoPath), Buffer.alloc(LIMIT_BYTES, 7)]);
    const res = await uploadClip(analyst, teamId, shotId, { buffer: big, name: 'long.mp4' });
    expectProblem(res, 413);
    expect(res.body.detail).toContain('upload limit of 256 KiB');
  });

  it('a video of absurd dimensions → 422 (8×8 and 32×8208)', async () => {
    for (const [w, h] of [[8, 8], [32, 8208]]) {
      const res = await uploadClip(analyst, teamId, shotId, await tinyClip(`odd-${w}x${h}.mp4`, w, h));
      expectProblem(res, 422);
      expect(res.body.detail).toContain(`${w}×${h} pixels`);
    }
  });

  it('no file part → 400; a missing capture rate → 400 with the field', async () => {
    const none = await analyst.post(`/api/teams/${teamId}/shots/${shotId}/clips`).set('X-Arcbench-Request', '1').field('captureFps', '240');
    expectProblem(none, 400);
    expect(none.body.detail).toMatch(/field `file`/);
    const noRate = await uploadClip(analyst, teamId, shotId, clean.videoPath, {});
    expectProblem(noRate, 400);
    expect(noRate.body.errors.map((e: { path: string }) => e.path)).toContain('body.captureFps');
  });

  it('JSON instead of multipart → 400', async () => {
    const res = await analyst.post(`/api/teams/${teamId}/shots/${shotId}/clips`).set('X-Arcbench-Request', '1').send({ captureFps: 240 });
    expectProblem(res, 400);
  });

  it('a file over the limit sent without a declared length (chunked) → 413 once the limit is crossed', async () => {
    const { port, cookie, close } = await listen();
    try {
      const boundary = '----arcbench-chunked';
      const res = await new Promise<{ status: number; type: string; body: string }>((resolve, reject) => {
        const req = http.request(
          {
            host: '127.0.0.1', port, method: 'POST', path: `/api/teams/${teamId}/shots/${shotId}/clips`,
            headers: { 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Transfer-Encoding': 'chunked', 'X-Arcbench-Request': '1', Cookie: cookie },
          },
          (r) => {
            let body = '';
            r.on('data', (d) => (body += d));
            r.on('end', () => resolve({ status: r.statusCode ?? 0, type: String(r.headers['content-type']), body }));
          },
        );
        req.on('error', reject);
        req.write(`--${boundary}\r\nContent-Disposition: form-data; name="captureFps"\r\n\r\n240\r\n`);
        req.write(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="long.mp4"\r\nContent-Type: video/mp4\r\n\r\n`);
        req.write(readFileSync(clean.videoPath));
        for (let i = 0; i < 8; i++) req.write(Buffer.alloc(64 * 1024, 1));
        req.end(`\r\n--${boundary}--\r\n`);
      });
      expect(res.status).toBe(413);
      expect(res.type).toMatch(/^application\/problem\+json/);
      expect(JSON.parse(res.body).detail).toContain('upload limit of 256 KiB');
    } finally {
      await close();
    }
  });

  it('an upload interrupted mid-stream leaves nothing behind', async () => {
    const { port, cookie, close } = await listen();
    try {
      const boundary = '----arcbench-interrupted';
      const head = Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="captureFps"\r\n\r\n240\r\n` +
          `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="shot.mp4"\r\nContent-Type: video/mp4\r\n\r\n`,
      );
      const req = http.request({
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: `/api/teams/${teamId}/shots/${shotId}/clips`,
        headers: {
          'Content-Type': `multipart/form-data; boundary=${boundary}`,
          'Content-Length': String(head.length + 200_000 + 64),
          'X-Arcbench-Request': '1',
          Cookie: cookie,
        },
      });
      req.on('error', () => {});
      req.write(head);
      req.write(readFileSync(clean.videoPath).subarray(0, 8000));
      // Wait until the server has started writing the file, then drop the connection. (An object
      // store holds the first part in memory until it is full, so there is nothing to see: wait a moment.)
      if (s3Run()) await new Promise((r) => setTimeout(r, 500));
      else {
        for (let i = 0; i < 100 && filesUnder(storageDir).length === 0; i++) await new Promise((r) => setTimeout(r, 50));
        expect(filesUnder(storageDir).length).toBeGreaterThan(0);
      }
      req.destroy();
    } finally {
      await close();
    }
  });
});
