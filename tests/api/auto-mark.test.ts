// Automatic marking end to end on a real generated clip: upload, real ffmpeg
// extraction by the job worker, calibration, then auto-mark through the API
// with the real tracking core. The generator's truth file is the outside
// reference the marks are checked against (each frame's true centre).
import { and, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { autoMarkRuns } from '../../server/db/schema/auto-mark';
import { clips } from '../../server/db/schema/clips';
import { marks } from '../../server/db/schema/marking';
import type { GeneratedClip } from '../../server/fixtures/clip-generator';
import { AUTO_MARK } from '../../server/jobs/auto-mark';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { localDiskStorage } from '../../server/storage/local-disk';
import type { Storage } from '../../server/storage/storage';
import type { AutoMarkRun } from '../../shared/schemas/auto-mark';
import type { FitDetail } from '../../shared/schemas/fits';
import type { Mark, MarksResponse } from '../../shared/schemas/marking';
import { demoTeamId, tempStorageDir } from '../support/clips';
import { calibrateFromTruth, createShotRecords, generateFitClip, uploadAndExtract } from '../support/fit-scenario';
import { createMarkingClip } from '../support/marking-clip';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const suffix = uniqueSuffix();
const jobSchema = `pgboss_automark_${suffix}`;
// A worker silent this long is taken for dead (the kill test waits this out once).
const STALE_SECONDS = 10;

/**
 * Real local-disk storage whose frame reads the test can slow down (so a run
 * is certainly still at work when it is cancelled) or freeze (a worker that
 * stops dead, as if killed, without any chance to clean up).
 */
function controllableStorage(inner: Storage) {
  const control = {
    delayMs: 0,
    freezeAfterReads: -1,
    frozen: false,
    release: () => {},
  };
  let gate: Promise<void> | null = null;
  const storage: Storage = Object.create(inner);
  storage.get = async (key: string) => {
    if (key.includes('/frames/')) {
      if (control.freezeAfterReads === 0 && !gate) {
        control.frozen = true;
        gate = new Promise<void>((resolve) => (control.release = resolve));
      }
      if (control.freezeAfterReads > 0) control.freezeAfterReads--;
      if (gate) await gate;
      if (control.delayMs > 0) await new Promise((r) => setTimeout(r, control.delayMs));
    }
    return inner.get(key);
  };
  return { storage, control };
}

let t: TestApp;
let second: TestApp | null = null;
let storageDir: string;
let generated: GeneratedClip;
let cleanupClip: () => Promise<void>;
let controlled: ReturnType<typeof controllableStorage>;
let teamId: string;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let tracker: Awaited<ReturnType<typeof signInAs>>;
let shotId: string;
let clipId: string;

beforeAll(async () => {
  storageDir = tempStorageDir('automark');
  controlled = controllableStorage(localDiskStorage(storageDir));
  const config = { storageDir, jobSchema, jobStaleSeconds: STALE_SECONDS };
  t = await createTestApp(config, { storage: controlled.storage }, { jobs: 'worker' });
  ({ clip: generated, cleanup: cleanupClip } = await generateFitClip());
  teamId = await demoTeamId(t.deps.db);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  const records = await createShotRecords(analyst, teamId, generated.truth);
  shotId = records.shotId;
  clipId = await uploadAndExtract(analyst, teamId, shotId, generated);
  await calibrateFromTruth(analyst, teamId, clipId, generated.truth);
}, 240_000);

afterAll(async () => {
  controlled?.control.release();
  await second?.close();
  await t?.close();
  await cleanupClip?.();
});

async function newTrack(name = 'Ball'): Promise<string> {
  const res = await tracker.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: `${name} ${uniqueSuffix()}`, kind: 'projectile' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

async function startRun(trackId: string, body: object = {}): Promise<string> {
  const res = await tracker.post(`/api/teams/${teamId}/tracks/${trackId}/auto-mark`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  return res.body.runId as string;
}

/** Polls the run as the workspace does (bounded; no timing is asserted). */
async function waitForRun(runId: string, done: (r: AutoMarkRun) => boolean = (r) => !['queued', 'running'].includes(r.state), timeoutMs = 120_000): Promise<AutoMarkRun> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await tracker.get(`/api/teams/${teamId}/auto-mark-runs/${runId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    if (done(res.body)) return res.body as AutoMarkRun;
    if (Date.now() > until) throw new Error(`run ${runId} still ${res.body.state} (progress ${res.body.progress}) after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function marksOf(trackId: string): Promise<MarksResponse> {
  const res = await tracker.get(`/api/teams/${teamId}/tracks/${trackId}/marks`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as MarksResponse;
}

async function storedMarkCount(trackId: string): Promise<number> {
  const [row] = await t.deps.db.select({ n: sql<number>`count(*)::int` }).from(marks).where(eq(marks.trackId, trackId));
  return row.n;
}

const truthOf = (frame: number) => generated.truth.frames.find((f) => f.frameNumber === frame);
const missPx = (m: Mark) => {
  const truth = truthOf(m.frameNumber);
  return truth ? Math.hypot(m.uPx - truth.uPx, m.vPx - truth.vPx) : Infinity;
};

let firstTrackId: string;
let firstMarks: Mark[];
const HAND_FRAME = 30;

describe('auto-marking a track', () => {
  it('marks the projectile through the clip, live, with source and confidence, and keeps a person’s mark', async () => {
    firstTrackId = await newTrack();
    const truth = truthOf(HAND_FRAME)!;
    // A person's mark 4 px off the truth: the automatic run must leave it where it is.
    const hand = await tracker.put(`/api/teams/${teamId}/tracks/${firstTrackId}/marks/${HAND_FRAME}`).send({ uPx: truth.uPx + 4, vPx: truth.vPx });
    expect(hand.status, JSON.stringify(hand.body)).toBe(200);

    const runId = await startRun(firstTrackId);
    const run = await waitForRun(runId);
    expect(run.state, run.error ?? '').toBe('done');
    expect(run.progress).toBe(1);
    expect(['left-frame', 'lost', 'end-of-clip']).toContain(run.endReason);
    expect(run.error).toBeNull();

    const body = await marksOf(firstTrackId);
    const auto = body.marks.filter((m) => m.source === 'auto');
    firstMarks = body.marks;
    console.info(`[auto-mark] ${auto.length} automatic marks; confidence quartiles ${[0.25, 0.5, 0.75].map((q) => auto.map((m) => m.confidence!).sort((x, y) => x - y)[Math.floor(q * (auto.length - 1))].toFixed(2)).join(' / ')}; flagged ${run.framesFlagged}; launch frame ${run.launchFrame}; ended ${run.endReason}`);
    expect(run.framesMarked).toBe(auto.length);
    expect(run.framesFlagged).toBe(auto.filter((m) => m.confidence! < run.reviewThreshold).length);
    for (const m of auto) {
      expect(m.confidence).toBeGreaterThanOrEqual(0);
      expect(m.confidence).toBeLessThanOrEqual(1);
      expect(m.snapped).toBe(false);
    }
    // The bar on generated clips with known truth: ≥ 98 % of visible frames within 1 px, none beyond 3 px.
    const visible = generated.truth.frames.filter((f) => f.frameNumber !== HAND_FRAME);
    const within1 = auto.filter((m) => missPx(m) <= 1).length;
    expect(within1 / visible.length).toBeGreaterThanOrEqual(0.98);
    expect(Math.max(...auto.map(missPx))).toBeLessThanOrEqual(3);

    const kept = body.marks.find((m) => m.frameNumber === HAND_FRAME)!;
    expect(kept.source).toBe('hand');
    expect(kept.confidence).toBeNull();
    expect(kept.uPx).toBeCloseTo(truth.uPx + 4, 9);
  });

  it('replaces a person’s mark only when asked to', async () => {
    const trackId = await newTrack('Replace');
    const truth = truthOf(HAND_FRAME)!;
    await tracker.put(`/api/teams/${teamId}/tracks/${trackId}/marks/${HAND_FRAME}`).send({ uPx: truth.uPx + 4, vPx: truth.vPx }).expect(200);
    const run = await waitForRun(await startRun(trackId, { replace: true }));
    expect(run.state, run.error ?? '').toBe('done');
    const replaced = (await marksOf(trackId)).marks.find((m) => m.frameNumber === HAND_FRAME)!;
    expect(replaced.source).toBe('auto');
    expect(missPx(replaced)).toBeLessThanOrEqual(1);
  });

  it('a person accepting or moving an automatic mark makes it theirs', async () => {
    const trackId = await newTrack('Accept');
    await waitForRun(await startRun(trackId, { fromFrame: 10, toFrame: 20 }));
    const before = (await marksOf(trackId)).marks.find((m) => m.frameNumber === 15)!;
    expect(before.source).toBe('auto');
    const moved = await tracker
      .put(`/api/teams/${teamId}/tracks/${trackId}/marks/15`)
      .send({ uPx: before.uPx + 0.5, vPx: before.vPx, snapped: true, expectedRevision: before.revision });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect(moved.body.mark.source).toBe('snap');
    expect(moved.body.mark.confidence).toBeNull();
    // The range was honoured.
    const frames = (await marksOf(trackId)).marks.map((m) => m.frameNumber);
    expect(Math.min(...frames)).toBeGreaterThanOrEqual(10);
    expect(Math.max(...frames)).toBeLessThanOrEqual(20);
  });
});

describe('bad input gets a clear answer', () => {
  it('refuses a clip whose frames are not extracted (409)', async () => {
    const bare = await createMarkingClip(t, analyst, teamId);
    await t.deps.db.update(clips).set({ status: 'extracting', progress: 0.3 }).where(eq(clips.id, bare));
    const track = await tracker.post(`/api/teams/${teamId}/clips/${bare}/tracks`).send({ name: 'Unextracted', kind: 'projectile' });
    expect(track.status).toBe(201);
    const res = await tracker.post(`/api/teams/${teamId}/tracks/${track.body.id}/auto-mark`).send({});
    expectProblem(res, 409);
    expect(res.body.detail).toMatch(/not extracted/);
  });

  it('refuses a seed outside the frame (400) and stores no run', async () => {
    const trackId = await newTrack('Seed');
    const { width } = generated.truth;
    for (const seed of [
      { frameNumber: 5, uPx: width + 10, vPx: 20 },
      { frameNumber: 5, uPx: 20, vPx: -1 },
      { frameNumber: generated.truth.frameCount + 50, uPx: 20, vPx: 20 },
    ]) {
      const res = await tracker.post(`/api/teams/${teamId}/tracks/${trackId}/auto-mark`).send({ seed });
      expectProblem(res, 400);
      expect(res.body.errors?.[0]?.path).toMatch(/^body\.seed\./);
    }
    const rows = await t.deps.db.select().from(autoMarkRuns).where(eq(autoMarkRuns.trackId, trackId));
    expect(rows).toEqual([]);
  });

  it('lets only the roles that mark start it', async () => {
    const viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
    const res = await viewer.post(`/api/teams/${teamId}/tracks/${firstTrackId}/auto-mark`).send({});
    expectProblem(res, 403);
  });
});

describe('stopping a run', () => {
  it('refuses a second run while one is at work (409), and cancel stops the marks', async () => {
    const trackId = await newTrack('Cancel');
    controlled.control.delayMs = 60;
    try {
      const runId = await startRun(trackId);
      await waitForRun(runId, (r) => r.state === 'running' && r.framesMarked > 0);
      const again = await tracker.post(`/api/teams/${teamId}/tracks/${trackId}/auto-mark`).send({});
      expectProblem(again, 409);

      const cancel = await tracker.post(`/api/teams/${teamId}/auto-mark-runs/${runId}/cancel`);
      expect(cancel.status, JSON.stringify(cancel.body)).toBe(200);
      expect(cancel.body.state).toBe('cancelled');
      const afterCancel = await storedMarkCount(trackId);
      // The job notices within a second; give it three, then nothing more may have been written.
      await new Promise((r) => setTimeout(r, 3000));
      expect(await storedMarkCount(trackId)).toBe(afterCancel);
      expect((await waitForRun(runId)).state).toBe('cancelled');
      expectProblem(await tracker.post(`/api/teams/${teamId}/auto-mark-runs/${runId}/cancel`), 409);
    } finally {
      controlled.control.delayMs = 0;
    }
  });

  it('ends cancelled, leaving no stray marks, when the clip is deleted mid-run', async () => {
    const doomedClip = await uploadAndExtract(analyst, teamId, shotId, generated);
    const track = await tracker.post(`/api/teams/${teamId}/clips/${doomedClip}/tracks`).send({ name: 'Doomed', kind: 'projectile' });
    const trackId = track.body.id as string;
    controlled.control.delayMs = 60;
    try {
      const runId = await startRun(trackId);
      await waitForRun(runId, (r) => r.state === 'running' && r.framesMarked > 0);
      expect(await storedMarkCount(trackId)).toBeGreaterThan(0);
      const del = await analyst.delete(`/api/teams/${teamId}/clips/${doomedClip}`);
      expect(del.status).toBe(204);
      const run = await waitForRun(runId);
      expect(run.state).toBe('cancelled');
      await new Promise((r) => setTimeout(r, 2000));
      expect(await storedMarkCount(trackId)).toBe(0);
      expect((await waitForRun(runId)).state).toBe('cancelled');
    } finally {
      controlled.control.delayMs = 0;
    }
  });
});

describe('the fit and automatic marks', () => {
  it('leaves out marks below the team’s threshold and says how many were automatic and by hand', async () => {
    const auto = firstMarks.filter((m) => m.source === 'auto');
    // Three of the marker's confident decisions made unsure (as a low-contrast stretch would), straight in the table.
    const unsure = auto.filter((m) => m.confidence! >= 0.6).slice(10, 13).map((m) => m.frameNumber);
    expect(unsure).toHaveLength(3);
    for (const frame of unsure) {
      await t.deps.db
        .update(marks)
        .set({ confidence: 0.2, lowConfidenceReason: 'weak contrast' })
        .where(and(eq(marks.trackId, firstTrackId), eq(marks.frameNumber, frame)));
    }
    const now = (await marksOf(firstTrackId)).marks;
    expect(now.filter((m) => unsure.includes(m.frameNumber)).map((m) => [m.confidence, m.lowConfidenceReason])).toEqual(unsure.map(() => [0.2, 'weak contrast']));
    const below = now.filter((m) => m.source === 'auto' && m.confidence! < 0.6).map((m) => m.frameNumber);

    const run = await analyst.post(`/api/teams/${teamId}/tracks/${firstTrackId}/fits`);
    expect(run.status, JSON.stringify(run.body)).toBe(201);
    const fit = (await analyst.get(`/api/teams/${teamId}/fits/${run.body.id}`)).body as FitDetail;
    const counts = fit.snapshot.markCounts!;
    expect(counts.leftOut).toBe(below.length);
    expect(counts.leftOutFrames.map((f) => f.frameNumber)).toEqual(below);
    expect(counts.leftOutFrames.filter((f) => unsure.includes(f.frameNumber)).map((f) => f.reason)).toEqual(['weak contrast', 'weak contrast', 'weak contrast']);
    expect(counts.automatic).toBe(auto.length - below.length);
    expect(counts.byHand).toBe(1);
    expect(counts.reviewThreshold).toBe(0.6);
    expect(fit.snapshot.marks.length).toBe(counts.automatic + counts.byHand);
    expect(fit.snapshot.marks.some((m) => below.includes(m.frameNumber))).toBe(false);

    // A team that trusts the marker more lowers its threshold; then only what is below the new one is left out.
    expectProblem(await tracker.put(`/api/teams/${teamId}/auto-mark-settings`).send({ reviewThreshold: 0.1 }), 403);
    expect((await analyst.put(`/api/teams/${teamId}/auto-mark-settings`).send({ reviewThreshold: 0.1 })).body).toEqual({ reviewThreshold: 0.1 });
    try {
      const again = await analyst.post(`/api/teams/${teamId}/tracks/${firstTrackId}/fits`);
      const refit = (await analyst.get(`/api/teams/${teamId}/fits/${again.body.id}`)).body as FitDetail;
      const belowNew = now.filter((m) => m.source === 'auto' && m.confidence! < 0.1).length;
      expect(refit.snapshot.markCounts!.reviewThreshold).toBe(0.1);
      expect(refit.snapshot.markCounts!.leftOut).toBe(belowNew);
      expect(refit.snapshot.marks.length).toBe(firstMarks.length - belowNew);
    } finally {
      await analyst.put(`/api/teams/${teamId}/auto-mark-settings`).send({ reviewThreshold: 0.6 }).expect(200);
    }
  });
});

describe('a worker that dies mid-run', () => {
  it('is retried by another worker and completes with no duplicate marks', async () => {
    const trackId = await newTrack('Killed');
    // This worker stops dead after a few frames: no more reads, no heartbeat, no clean-up.
    controlled.control.freezeAfterReads = 25;
    const runId = await startRun(trackId);
    await waitForRun(runId, (r) => controlled.control.frozen && r.state === 'running');
    // A second worker process on the same queue (its own storage handle onto the same files).
    second = await createTestApp({ storageDir, jobSchema, jobStaleSeconds: STALE_SECONDS }, {}, { jobs: 'worker' });
    const run = await waitForRun(runId, undefined, 180_000);
    expect(run.state, run.error ?? '').toBe('done');

    const [row] = await t.deps.db.select().from(autoMarkRuns).where(eq(autoMarkRuns.id, runId));
    expect(row.attempt).toBeGreaterThanOrEqual(2);
    const job = await t.queue!.boss.getJobById(AUTO_MARK, row.jobId!);
    expect(job?.retryCount).toBeGreaterThanOrEqual(1);

    const [{ rows, distinct }] = await t.deps.db
      .select({ rows: sql<number>`count(*)::int`, distinct: sql<number>`count(distinct ${marks.frameNumber})::int` })
      .from(marks)
      .where(eq(marks.trackId, trackId));
    expect(rows).toBe(distinct);
    const after = (await marksOf(trackId)).marks;
    expect(after.length).toBe(run.framesMarked);
    // The retried run decided exactly what an undisturbed run decided on the same clip.
    const reference = firstMarks.filter((m) => m.source === 'auto');
    const byFrame = new Map(after.map((m) => [m.frameNumber, m]));
    for (const m of reference) {
      const again = byFrame.get(m.frameNumber);
      expect(again, `frame ${m.frameNumber}`).toBeDefined();
      expect(again!.uPx).toBeCloseTo(m.uPx, 6);
      expect(again!.vPx).toBeCloseTo(m.vPx, 6);
    }

    // The frozen attempt wakes up: it no longer owns the run and writes nothing.
    const revisionBefore = (await marksOf(trackId)).trackRevision;
    controlled.control.freezeAfterReads = -1;
    controlled.control.release();
    await new Promise((r) => setTimeout(r, 2000));
    expect((await marksOf(trackId)).trackRevision).toBe(revisionBefore);
    expect(await storedMarkCount(trackId)).toBe(rows);
  }, 300_000);
});
