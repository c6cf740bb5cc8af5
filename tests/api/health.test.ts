// /api/health is cheap: twenty anonymous callers at once start ffmpeg at most
// once between them (it is probed at start and then at most once a minute).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FFMPEG_PROBE_INTERVAL_MS, ffmpegProbeCount, primeFfmpegProbe } from '../../server/health/system-status';
import { hashPassword } from '../../server/auth/passwords';
import { users } from '../../server/db/schema/users';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  await primeFfmpegProbe(); // as server/index.ts does at start
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('answers twenty anonymous callers without starting ffmpeg for each', async () => {
    const before = ffmpegProbeCount();
    const answers = await Promise.all(Array.from({ length: 20 }, () => request(t.app).get('/api/health')));
    for (const res of answers) {
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ status: 'ok', database: { ok: true }, ffmpeg: { ok: true } });
    }
    // At most one background refresh, and only if a minute has passed since the start-up probe.
    expect(ffmpegProbeCount() - before).toBeLessThanOrEqual(1);
    expect(FFMPEG_PROBE_INTERVAL_MS).toBe(60_000);
  });

  it('tells anonymous callers no versions (those are for admins)', async () => {
    const res = await request(t.app).get('/api/health');
    expect(JSON.stringify(res.body)).not.toMatch(/version|PostgreSQL \d/i);
  });

  it('gives the detailed check (versions, latency) to a team admin only', async () => {
    expectProblem(await request(t.app).get('/api/health?detail=1'), 403);
    // A fresh person who admins no team (the demo viewer may own teams other suites created).
    const email = `no-admin-${uniqueSuffix()}@example.test`;
    await t.deps.db.insert(users).values({ email, displayName: 'Not an admin', passwordHash: await hashPassword(DEMO_PASSWORD) });
    const plain = await signInAs(t.app, email, DEMO_PASSWORD);
    expectProblem(await plain.get('/api/health?detail=1'), 403);
    const admin = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
    const res = await admin.get('/api/health?detail=1');
    expect(res.status).toBe(200);
    expect(res.body.database).toMatchObject({ ok: true, version: expect.stringMatching(/^PostgreSQL \d+/), latencyMs: expect.any(Number) });
    expect(res.body.ffmpeg).toMatchObject({ ok: true, version: expect.stringMatching(/^ffmpeg version/) });
  });
});
