// The real server (server/index.ts, in-process worker) is SIGKILLed — no chance
// to clean up — once in the middle of receiving an upload and once in the middle
// of extracting frames. After a restart: no half-received upload and no frame
// scratch is left, no ffmpeg of the old server still runs, and the interrupted
// extraction completes with exactly one frame per source frame.
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connect, type Database } from '../../server/db/client';
import { clipFrames, clips } from '../../server/db/schema/clips';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { freePort } from '../support/app-server';
import { createShot, demoTeamId, filesUnder, fixtureDir, tempStorageDir } from '../support/clips';
import { uniqueSuffix } from '../support/test-app';

const root = path.resolve(import.meta.dirname, '../..');
const suffix = uniqueSuffix();
const STALE_SECONDS = 4;
let storageDir: string;
let database: Database;
let big: GeneratedClip;
let teamId: string;
const servers: ChildProcess[] = [];

interface Running {
  child: ChildProcess;
  url: string;
  port: number;
  output: () => string;
}

/** node with the tsx loader directly, so the pid we kill is the server itself. */
async function startServer(): Promise<Running> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      SMTP_URL: '',
      STORAGE_DIR: storageDir,
      JOB_SCHEMA: `pgboss_killsrv_${suffix}`,
      JOB_STALE_SECONDS: String(STALE_SECONDS),
      SIGN_IN_LIMIT: '1000',
      CLIENT_DIST: path.join(storageDir, 'no-client'),
    },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  servers.push(child);
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const url = await new Promise<string>((resolve, reject) => {
    child.on('message', (m: { ready?: boolean; url?: string }) => m.ready && m.url && resolve(m.url));
    child.on('exit', (code) => reject(new Error(`server exited (${code}) before it was ready:\n${output}`)));
  });
  return { child, url, port, output: () => output };
}

async function kill(server: Running) {
  const exited = new Promise((r) => server.child.once('exit', r));
  process.kill(server.child.pid!, 'SIGKILL');
  await exited;
}

async function signIn(server: Running): Promise<string> {
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-arcbench-request': '1' },
    body: JSON.stringify({ email: demoPerson('analyst').email, password: DEMO_PASSWORD }),
  });
  expect(res.status, `${await res.text()}\n${server.output()}`).toBe(200);
  return res.headers.getSetCookie()[0].split(';')[0];
}

/**
 * A multipart upload we pace ourselves: the head and the first `sendFirst` bytes
 * of the file go at once, the rest only when `finish` is called (never, if the
 * server dies first).
 */
function pacedUpload(port: number, cookie: string, shotId: string, file: Buffer, sendFirst: number) {
  const boundary = `----arcbench${suffix}`;
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="captureFps"\r\n\r\n240\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="shot.mp4"\r\nContent-Type: video/mp4\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const req = http.request({
    host: '127.0.0.1',
    port,
    method: 'POST',
    path: `/api/teams/${teamId}/shots/${shotId}/clips`,
    headers: {
      cookie,
      'x-arcbench-request': '1',
      'content-type': `multipart/form-data; boundary=${boundary}`,
      'content-length': head.length + file.length + tail.length,
    },
  });
  const outcome = new Promise<string>((resolve) => {
    req.on('response', (res) => resolve(`answered ${res.statusCode}`));
    req.on('error', (err) => resolve(`connection ended: ${err.message}`));
  });
  req.write(head);
  req.write(file.subarray(0, sendFirst));
  return { outcome, finish: () => req.end(Buffer.concat([file.subarray(sendFirst), tail])) };
}

/** Live ffmpeg/ffprobe processes working on files of this test's storage. */
function ffmpegOnOurFiles(): number[] {
  const pids: number[] = [];
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    let cmd: string;
    try {
      cmd = readFileSync(`/proc/${name}/cmdline`, 'utf8');
    } catch {
      continue;
    }
    const [exe] = cmd.split('\0');
    if (/ff(mpeg|probe)$/.test(exe) && cmd.includes(storageDir)) {
      // A zombie (exited, not yet reaped) runs nothing.
      const state = readFileSync(`/proc/${name}/stat`, 'utf8').split(') ')[1]?.[0];
      if (state !== 'Z') pids.push(Number(name));
    }
  }
  return pids;
}

async function until<T>(what: string, get: () => Promise<T> | T, ok: (v: T) => boolean, limitMs = 60_000): Promise<T> {
  const end = Date.now() + limitMs;
  for (;;) {
    const v = await get();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`${what}: still ${JSON.stringify(v)} after ${limitMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

const partials = () => filesUnder(storageDir).filter((f) => f.includes('.partial-'));
const scratch = () => filesUnder(storageDir).filter((f) => f.startsWith('tmp/'));

beforeAll(async () => {
  storageDir = tempStorageDir('killsrv');
  database = connect(process.env.DATABASE_URL!, 2);
  teamId = await demoTeamId(database.db);
  // Long enough that extraction is certainly still running when the server is killed.
  big = await generatePreset('clean', fixtureDir('killsrv'), { name: 'long-shot', frameCount: 2400, noiseSigma: 0, crf: 24, x264Preset: 'ultrafast' });
}, 300_000);

afterAll(async () => {
  for (const s of servers) if (s.exitCode === null && s.signalCode === null) s.kill('SIGKILL');
  await database.close();
});

describe('a server killed with SIGKILL', () => {
  it('during an upload leaves nothing behind once it is restarted', async () => {
    const shotId = await createShot(database.db, teamId, `${suffix}-up`);
    const file = readFileSync(big.videoPath);
    const first = await startServer();
    const upload = pacedUpload(first.port, await signIn(first), shotId, file, Math.floor(file.length / 2));
    // The first half is on its way into the store as a partial file.
    await until('a partial upload in the store', partials, (p) => p.length === 1);
    await kill(first);
    expect(await upload.outcome).toMatch(/connection ended/);
    expect(partials()).toHaveLength(1); // what the killed server left

    const second = await startServer();
    try {
      expect(partials()).toEqual([]);
      expect(scratch()).toEqual([]);
      const [{ n }] = await database.db.select({ n: sql<number>`count(*)::int` }).from(clips).where(eq(clips.shotId, shotId));
      expect(n).toBe(0);
    } finally {
      await kill(second);
    }
  }, 300_000);

  it('during an extraction: no ffmpeg survives it, and after a restart the clip has exactly the right frames', async () => {
    const shotId = await createShot(database.db, teamId, `${suffix}-ex`);
    const first = await startServer();
    const cookie = await signIn(first);
    const form = new FormData();
    form.set('captureFps', '240');
    form.set('file', new Blob([readFileSync(big.videoPath)], { type: 'video/mp4' }), 'long-shot.mp4');
    const res = await fetch(`${first.url}/api/teams/${teamId}/shots/${shotId}/clips`, { method: 'POST', headers: { cookie, 'x-arcbench-request': '1' }, body: form });
    const body = (await res.json()) as { id: string };
    expect(res.status, JSON.stringify(body)).toBe(201);
    const clipId = body.id;

    const getClip = async (url: string, c: string) =>
      (await (await fetch(`${url}/api/teams/${teamId}/clips/${clipId}`, { headers: { cookie: c } })).json()) as { status: string; progress: number; extractedCount: number; error: string | null };
    const running = await until('extraction under way', () => getClip(first.url, cookie), (c) => (c.status === 'extracting' && c.progress > 0) || c.status === 'ready', 180_000);
    expect(running.status, 'extraction finished before the server could be killed').toBe('extracting');
    const ffmpegBefore = ffmpegOnOurFiles();
    expect(ffmpegBefore.length, 'no ffmpeg seen working on the clip').toBeGreaterThan(0);

    await kill(first);
    // The watchdog ends the old server's ffmpeg; nothing keeps writing frames.
    await until('ffmpeg of the killed server', ffmpegOnOurFiles, (p) => p.length === 0, 30_000);

    const second = await startServer();
    try {
      const c2 = await signIn(second);
      const ready = await until('extraction after the restart', () => getClip(second.url, c2), (c) => ['ready', 'failed', 'cancelled'].includes(c.status), 300_000);
      expect(ready.status, ready.error ?? '').toBe('ready');
      expect(ready.extractedCount).toBe(big.truth.frameCount);

      const frames = (await (await fetch(`${second.url}/api/teams/${teamId}/clips/${clipId}/frames`, { headers: { cookie: c2 } })).json()) as { frameNumber: number }[];
      expect(frames.map((f) => f.frameNumber)).toEqual(big.truth.frames.map((f) => f.frameNumber));
      const [{ rows, distinct }] = await database.db
        .select({ rows: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct ${clipFrames.frameNumber})::int` })
        .from(clipFrames)
        .where(eq(clipFrames.clipId, clipId));
      expect([rows, distinct]).toEqual([big.truth.frameCount, big.truth.frameCount]);

      // On disk: one frame set, one file per frame, no scratch and no partial upload.
      const files = filesUnder(storageDir);
      const frameFiles = files.filter((f) => f.includes(`/clips/${clipId}/v-`) && f.includes('/frames/'));
      expect(frameFiles.length).toBe(big.truth.frameCount);
      expect(new Set(frameFiles.map((f) => f.split('/v-')[1].split('/')[0])).size).toBe(1);
      expect(scratch()).toEqual([]);
      expect(partials()).toEqual([]);
      expect(ffmpegOnOurFiles()).toEqual([]);
    } finally {
      await kill(second);
    }
  }, 600_000);
});
