// The worker dies mid-extraction (SIGKILL, no chance to clean up). A new worker
// notices the silent job, pg-boss retries it, and the clip ends with exactly
// one frame per source frame: none duplicated, none missing, one frame set on disk.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clipFrames, clips } from '../../server/db/schema/clips';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { EXTRACT_FRAMES } from '../../server/jobs/queue';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { ClipFrameView } from '../../shared/schemas/clips';
import { createShot, demoTeamId, filesUnder, fixtureDir, tempStorageDir, uploadClip, waitForClip } from '../support/clips';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const root = path.resolve(import.meta.dirname, '../..');
const suffix = uniqueSuffix();
const jobSchema = `pgboss_kill_${suffix}`;
const STALE_SECONDS = 4;
let t: TestApp;
let storageDir: string;
let big: GeneratedClip;
const workers: ChildProcess[] = [];

/** The worker as its own process: node with the tsx loader directly, so the pid we kill is the worker itself. */
function startWorker(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
    cwd: root,
    env: { ...process.env, JOB_SCHEMA: jobSchema, STORAGE_DIR: storageDir, JOB_STALE_SECONDS: String(STALE_SECONDS) },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  workers.push(child);
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  return new Promise((resolve, reject) => {
    child.on('message', (m: { ready?: boolean }) => m.ready && resolve(child));
    child.on('exit', (code) => reject(new Error(`worker exited (${code}) before it was ready:\n${output}`)));
  });
}

beforeAll(async () => {
  storageDir = tempStorageDir('kill');
  t = await createTestApp({ storageDir, jobSchema, jobStaleSeconds: STALE_SECONDS }, {}, { jobs: 'send-only' });
  // Long enough that extraction is certainly still running when the worker is killed.
  big = await generatePreset('clean', fixtureDir('kill'), { name: 'long-shot', frameCount: 2400, noiseSigma: 0, crf: 24, x264Preset: 'ultrafast' });
}, 240_000);

afterAll(async () => {
  for (const w of workers) if (w.exitCode === null && w.signalCode === null) w.kill('SIGKILL');
  await t.close();
});

describe('a worker killed mid-extraction', () => {
  it('is retried by the next worker and completes with exactly the right frames', async () => {
    const teamId = await demoTeamId(t.deps.db);
    const shotId = await createShot(t.deps.db, teamId, suffix);
    const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);

    const first = await startWorker();
    const res = await uploadClip(analyst, teamId, shotId, big.videoPath, { captureFps: 240 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const clipId = res.body.id as string;

    const running = await waitForClip(analyst, teamId, clipId, (c) => (c.status === 'extracting' && c.progress > 0) || c.status === 'ready', 120_000);
    expect(running.status, 'extraction finished before the worker could be killed').toBe('extracting');
    process.kill(first.pid!, 'SIGKILL');
    await new Promise((r) => first.once('exit', r));
    const [afterKill] = await t.deps.db.select({ status: clips.status }).from(clips).where(eq(clips.id, clipId));
    expect(afterKill.status).toBe('extracting');

    await startWorker();
    const ready = await waitForClip(analyst, teamId, clipId, undefined, 180_000);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.extractedCount).toBe(big.truth.frameCount);

    // pg-boss ran the same job again (a retry, not a new job).
    const [clipRow] = await t.deps.db.select({ jobId: clips.jobId }).from(clips).where(eq(clips.id, clipId));
    // The clip is ready inside the handler; pg-boss marks the job completed just after it returns.
    let job = await t.queue!.boss.getJobById(EXTRACT_FRAMES, clipRow.jobId!);
    for (let i = 0; i < 100 && job?.state === 'active'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = await t.queue!.boss.getJobById(EXTRACT_FRAMES, clipRow.jobId!);
    }
    expect(job?.state).toBe('completed');
    expect(job?.retryCount).toBeGreaterThanOrEqual(1);

    const frames = (await analyst.get(`/api/teams/${teamId}/clips/${clipId}/frames`)).body as ClipFrameView[];
    expect(frames.map((f) => f.frameNumber)).toEqual(big.truth.frames.map((f) => f.frameNumber));
    const [{ rows, distinct }] = await t.deps.db
      .select({ rows: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct ${clipFrames.frameNumber})::int` })
      .from(clipFrames)
      .where(eq(clipFrames.clipId, clipId));
    expect([rows, distinct]).toEqual([big.truth.frameCount, big.truth.frameCount]);

    // On disk: one frame set with one file per frame, and no scratch left from the killed run.
    const files = filesUnder(storageDir);
    const frameFiles = files.filter((f) => f.includes(`/clips/${clipId}/v-`) && f.includes('/frames/'));
    expect(frameFiles.length).toBe(big.truth.frameCount);
    expect(new Set(frameFiles.map((f) => f.split('/v-')[1].split('/')[0])).size).toBe(1);
    expect(files.filter((f) => f.startsWith('tmp/'))).toEqual([]);
  }, 480_000);
});
