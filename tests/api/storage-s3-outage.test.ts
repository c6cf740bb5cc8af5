// The object store goes away (project api-s3): the app talks to the fake
// through a proxy this file cuts, so the other files keep their store.
// - During an upload: 503 problem+json, and nothing of the file is kept.
// - During a job: the clip says it is waiting for storage, pg-boss retries
//   with backoff, and once the store is back the frames arrive.
import { mkdtempSync } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { clips } from '../../server/db/schema/clips';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { EXTRACT_FRAMES } from '../../server/jobs/queue';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { createStorage } from '../../server/storage/create-storage';
import { PART_SIZE_BYTES } from '../../server/storage/s3';
import { s3Run } from '../support/api-s3-run';
import { cuttableProxy, type CuttableProxy } from '../support/api-s3-proxy';
import { createShot, demoTeamId, fixtureDir, uploadClip, waitForClip } from '../support/clips';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const s3 = s3Run();
const suffix = uniqueSuffix();
const prefix = `outage-${suffix}/`;
let proxy: CuttableProxy;
let t: TestApp;
let clip: GeneratedClip;
let teamId: string;
let shotId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;

/** The same bucket and prefix, but straight to the fake: what is really stored. */
function directStorage() {
  const config = loadConfig({ DATABASE_URL: process.env.DATABASE_URL, ...s3!.storageEnv, STORAGE_URL: `s3://${s3!.bucket}/${prefix}` });
  return createStorage(config, mkdtempSync(path.join(process.env.ARCBENCH_TMP!, 'outage-direct-')));
}

beforeAll(async () => {
  if (!s3) return;
  proxy = await cuttableProxy(s3.endpoint);
  const base = loadConfig({ DATABASE_URL: process.env.DATABASE_URL, ...s3.storageEnv, STORAGE_URL: `s3://${s3.bucket}/${prefix}`, S3_ENDPOINT: proxy.endpoint });
  t = await createTestApp({ storage: base.storage, jobSchema: `pgboss_outage_${suffix}`, jobStaleSeconds: 4 }, {}, { jobs: 'send-only', ownWorkers: true });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  clip = await generatePreset('clean', fixtureDir('outage'), { frameCount: 30 });
}, 180_000);

afterAll(async () => {
  await t?.close();
  await proxy?.close();
});

describe.runIf(s3)('the object store unreachable', () => {
  it('during an upload: 503 problem+json and nothing of the file kept', async () => {
    // Big enough for a multipart upload; the store goes away once the first part is on its way.
    const body = randomBytes(3 * PART_SIZE_BYTES);
    const cut = proxy.cutAfter(PART_SIZE_BYTES + 512 * 1024);
    const res = await uploadClip(analyst, teamId, shotId, { buffer: body, name: 'shot.mp4' }, { captureFps: 240 });
    await cut;
    expectProblem(res, 503);
    expect(res.body.detail).toMatch(/store cannot be reached/);
    await proxy.restore();

    expect(await t.deps.db.select({ id: clips.id }).from(clips).where(eq(clips.shotId, shotId))).toEqual([]);
    // Nothing under this app's prefix at all: no object, whole or partial. (Parts of a multipart
    // upload whose abort could not reach the store are not objects; docs/deploy.md has the
    // bucket rule that expires them. s3rver cannot list them: ListMultipartUploads is not implemented.)
    expect(await directStorage().list('')).toEqual([]);
    // The app answers uploads again once the store is back.
    const again = await uploadClip(analyst, teamId, shotId, clip.videoPath, { captureFps: 240 });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    await analyst.delete(`/api/teams/${teamId}/clips/${again.body.id}`).expect(204);
  });

  it('during a job: the clip waits for storage, the job retries with backoff, and completes when the store is back', async () => {
    const up = await uploadClip(analyst, teamId, shotId, clip.videoPath, { captureFps: 240 });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const clipId = up.body.id as string;
    await proxy.cut();
    // A worker of this file's own queue, with its own scratch folder.
    const scratchDir = mkdtempSync(path.join(process.env.ARCBENCH_TMP!, 'outage-worker-'));
    await t.queue!.startWorker({ db: t.deps.db, storage: createStorage(t.deps.config, scratchDir), config: t.deps.config, scratchDir });

    const waiting = await waitForClip(analyst, teamId, clipId, (c) => c.waitingFor === 'storage' || ['ready', 'failed'].includes(c.status), 60_000);
    expect(waiting.status).toBe('queued');
    expect(waiting.waitingFor).toBe('storage');
    expect(waiting.error).toMatch(/Waiting for the file store/);

    await proxy.restore();
    const ready = await waitForClip(analyst, teamId, clipId, undefined, 120_000);
    expect(ready.status, ready.error ?? '').toBe('ready');
    expect(ready.waitingFor).toBeNull();
    expect(ready.extractedCount).toBe(clip.truth.frameCount);
    const frames = await analyst.get(`/api/teams/${teamId}/clips/${clipId}/frames`);
    expect(frames.body.map((f: { frameNumber: number }) => f.frameNumber)).toEqual(clip.truth.frames.map((f) => f.frameNumber));

    // pg-boss ran the same job again after the failed attempt.
    const [row] = await t.deps.db.select({ jobId: clips.jobId }).from(clips).where(eq(clips.id, clipId));
    let job = await t.queue!.boss.getJobById(EXTRACT_FRAMES, row.jobId!);
    for (let i = 0; i < 100 && job?.state === 'active'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = await t.queue!.boss.getJobById(EXTRACT_FRAMES, row.jobId!);
    }
    expect(job?.state).toBe('completed');
    expect(job?.retryCount).toBeGreaterThanOrEqual(1);
  }, 240_000);
});
