// Two workers on the object store (project api-s3), each a process of its own
// with its own scratch folder and nothing but the database and S3 settings.
// One is killed (SIGKILL) mid-extraction: the other finishes the job with
// exactly the right frames, no duplicates, and no orphan objects in the bucket.
// A worker started on the dead one's scratch folder sweeps it; a worker told
// to stop (SIGTERM) hands its job back and removes its scratch folder.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { clipFrames, clips } from '../../server/db/schema/clips';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { THUMBNAIL_COUNT } from '../../server/jobs/extract-frames';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { ClipFrameView } from '../../shared/schemas/clips';
import { s3Run } from '../support/api-s3-run';
import { createShot, demoTeamId, filesUnder, fixtureDir, uploadClip, waitForClip } from '../support/clips';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const root = path.resolve(import.meta.dirname, '../..');
const s3 = s3Run();
const suffix = uniqueSuffix();
const prefix = `workers-${suffix}/`;
const jobSchema = `pgboss_s3kill_${suffix}`;
const STALE_SECONDS = 4;
let t: TestApp;
let big: GeneratedClip;
let teamId: string;
let shotId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;
const workers: ChildProcess[] = [];
let clipOfFirstTest: string | undefined;

interface Worker {
  child: ChildProcess;
  scratchDir: string;
  /** What it printed, for failure messages. */
  output: () => string;
}

/** node with the tsx loader directly, so the pid we signal is the worker itself. */
function startWorker(scratchDir: string, extraEnv: Record<string, string> = {}): Promise<Worker> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
    cwd: root,
    // Only what a worker on another machine would have: the database and the store.
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      DATABASE_URL: process.env.DATABASE_URL,
      ...s3!.storageEnv,
      STORAGE_URL: `s3://${s3!.bucket}/${prefix}`,
      JOB_SCHEMA: jobSchema,
      JOB_STALE_SECONDS: String(STALE_SECONDS),
      SCRATCH_DIR: scratchDir,
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  workers.push(child);
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  return new Promise((resolve, reject) => {
    child.on('message', (m: { ready?: boolean }) => m.ready && resolve({ child, scratchDir, output: () => output.slice(-3000) }));
    child.on('exit', (code) => reject(new Error(`worker exited (${code}) before it was ready:\n${output}`)));
  });
}

const exited = (w: Worker) => new Promise<void>((r) => (w.child.exitCode !== null || w.child.signalCode !== null ? r() : w.child.once('exit', () => r())));
const scratchOf = (label: string) => path.join(mkdtempSync(path.join(process.env.ARCBENCH_TMP!, `s3-${label}-`)), 'scratch');
/** Whose scratch folder holds this clip's extraction. */
const extracting = (ws: Worker[], clipId: string) => ws.find((w) => filesUnder(w.scratchDir).some((f) => f.startsWith(`extract/${clipId}-`)));

beforeAll(async () => {
  if (!s3) return;
  const settings = loadConfig({ DATABASE_URL: process.env.DATABASE_URL, ...s3.storageEnv, STORAGE_URL: `s3://${s3.bucket}/${prefix}` }).storage;
  t = await createTestApp({ storage: settings, jobSchema, jobStaleSeconds: STALE_SECONDS }, {}, { jobs: 'send-only', ownWorkers: true });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  // Long enough that extraction is certainly still running when a worker is stopped.
  big = await generatePreset('clean', fixtureDir('s3-kill'), { name: 'long-shot', frameCount: 1200, noiseSigma: 0, crf: 24, x264Preset: 'ultrafast' });
}, 240_000);

afterAll(async () => {
  for (const w of workers) if (w.exitCode === null && w.signalCode === null) w.kill('SIGKILL');
  await t?.close();
});

describe.runIf(s3)('workers on the object store', () => {
  it('one killed mid-extraction: the other finishes with exactly the right frames and no orphan objects', async () => {
    const pair = await Promise.all([startWorker(scratchOf('a')), startWorker(scratchOf('b'))]);
    const res = await uploadClip(analyst, teamId, shotId, big.videoPath, { captureFps: 240 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const clipId = res.body.id as string;

    const running = await waitForClip(analyst, teamId, clipId, (c) => (c.status === 'extracting' && c.progress > 0) || c.status === 'ready', 120_000);
    expect(running.status, 'extraction finished before a worker could be killed').toBe('extracting');
    const victim = extracting(pair, clipId)!;
    expect(victim, 'no worker has the clip in its scratch folder').toBeDefined();
    const survivor = pair.find((w) => w !== victim)!;
    victim.child.kill('SIGKILL');
    await exited(victim);

    const ready = await waitForClip(analyst, teamId, clipId, undefined, 180_000);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.extractedCount).toBe(big.truth.frameCount);
    const frames = (await analyst.get(`/api/teams/${teamId}/clips/${clipId}/frames`)).body as ClipFrameView[];
    expect(frames.map((f) => f.frameNumber)).toEqual(big.truth.frames.map((f) => f.frameNumber));
    const [{ rows, distinct }] = await t.deps.db
      .select({ rows: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct ${clipFrames.frameNumber})::int` })
      .from(clipFrames)
      .where(eq(clipFrames.clipId, clipId));
    expect([rows, distinct]).toEqual([big.truth.frameCount, big.truth.frameCount]);

    // The bucket under this file's prefix: the original, one frame set with one object per frame, its thumbnails. Nothing else.
    const [row] = await t.deps.db.select({ framesPrefix: clips.framesPrefix, storageKey: clips.storageKey }).from(clips).where(eq(clips.id, clipId));
    const expected = [
      row.storageKey,
      ...big.truth.frames.map((f) => `${row.framesPrefix}frames/${String(f.frameNumber).padStart(6, '0')}.jpg`),
      ...Array.from({ length: THUMBNAIL_COUNT }, (_, i) => `${row.framesPrefix}thumbs/thumb-${String(i).padStart(2, '0')}.jpg`),
    ].sort();
    let keys = await t.deps.storage.list('');
    for (let i = 0; i < 50 && keys.length !== expected.length; i++) {
      await new Promise((r) => setTimeout(r, 100));
      keys = await t.deps.storage.list('');
    }
    expect(keys).toEqual(expected);

    // The killed worker could not clean up; the next worker on its scratch folder sweeps it.
    expect(filesUnder(victim.scratchDir).length).toBeGreaterThan(0);
    const successor = await startWorker(victim.scratchDir);
    expect(filesUnder(successor.scratchDir)).toEqual([]);
    // Stopped properly, workers remove their scratch folders.
    for (const w of [survivor, successor]) {
      w.child.kill('SIGTERM');
      await exited(w);
      expect(w.child.exitCode, `worker ended by ${w.child.signalCode}:\n${w.output()}`).toBe(0);
      expect(existsSync(w.scratchDir)).toBe(false);
    }
    clipOfFirstTest = clipId;
  }, 480_000);

  it('one told to stop mid-extraction hands its job back; another worker completes it', async () => {
    const first = await startWorker(scratchOf('c'), { WORKER_STOP_GRACE_SECONDS: '0' });
    // The same clip again, on a new range: a second extraction without another upload.
    const clipId = clipOfFirstTest!;
    expect(clipId, 'the first test did not finish').toBeDefined();
    const patched = await analyst.patch(`/api/teams/${teamId}/clips/${clipId}`).send({ inFrame: 0, outFrame: 899 });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    const running = await waitForClip(analyst, teamId, clipId, (c) => (c.status === 'extracting' && c.progress > 0) || c.status === 'ready', 120_000);
    expect(running.status, 'extraction finished before the worker could be stopped').toBe('extracting');

    first.child.kill('SIGTERM');
    await exited(first);
    expect(first.child.exitCode, `worker ended by ${first.child.signalCode}:\n${first.output()}`).toBe(0);
    expect(existsSync(first.scratchDir)).toBe(false);
    const [handedBack] = await t.deps.db.select({ status: clips.status }).from(clips).where(eq(clips.id, clipId));
    expect(handedBack.status).toBe('queued');

    const second = await startWorker(scratchOf('d'));
    const ready = await waitForClip(analyst, teamId, clipId, (c) => c.status !== 'queued' && c.status !== 'extracting' && c.outFrame === 899, 180_000);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.extractedCount).toBe(900);
    second.child.kill('SIGTERM');
    await exited(second);
    expect(second.child.exitCode, `worker ended by ${second.child.signalCode}:\n${second.output()}`).toBe(0);
  }, 480_000);
});
