// The demo team starts with shots whose clips are already extracted, and
// seeding again changes nothing (no new rows, nothing re-rendered).
import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clipFrames, clips } from '../../server/db/schema/clips';
import { shots, testSeries } from '../../server/db/schema/records';
import { DEMO_STEPS } from '../../server/seed/demo-steps';
import { DEMO_SERIES_NAME } from '../../server/seed/demo-records';
import { seedDemo } from '../../server/seed/seed-demo';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { demoTeamId, storedKeys } from '../support/clips';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t.deps.db);
});
afterAll(() => t.close());

async function demoClips() {
  const [series] = await t.deps.db.select({ id: testSeries.id }).from(testSeries).where(and(eq(testSeries.teamId, teamId), eq(testSeries.name, DEMO_SERIES_NAME)));
  // Other areas may add shots to the same series; these three are the clips step's own.
  const shotRows = await t.deps.db
    .select({ id: shots.id, label: shots.label })
    .from(shots)
    .where(and(eq(shots.seriesId, series.id), inArray(shots.label, ['H-01', 'H-02', 'H-03'])))
    .orderBy(shots.label);
  const clipRows = shotRows.length
    ? await t.deps.db.select().from(clips).where(inArray(clips.shotId, shotRows.map((s) => s.id))).orderBy(clips.createdAt)
    : [];
  return { shotRows, clipRows };
}

describe('demo clips', () => {
  it('three shots of the morning session, each with a ready clip whose frames are served', async () => {
    const { shotRows, clipRows } = await demoClips();
    expect(shotRows.map((s) => s.label)).toEqual(['H-01', 'H-02', 'H-03']);
    expect(clipRows).toHaveLength(3);
    for (const c of clipRows) {
      expect(c.status).toBe('ready');
      expect(c.extractedCount).toBe(c.frameCount);
    }
    // H-02 was filmed in slow motion: the warning is there.
    const h02 = clipRows.find((c) => c.shotId === shotRows[1].id)!;
    expect(h02.timeBaseWarnings.map((w) => w.code)).toContain('rate-differs');
    const tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
    const res = await tracker.get(`/api/teams/${teamId}/clips/${clipRows[0].id}/frames/0/image`);
    expect(res.status).toBe(200);
  });

  it('seeding again changes nothing', async () => {
    const before = await demoClips();
    const filesBefore = (await storedKeys(t)).filter((f) => before.clipRows.some((c) => f.includes(c.id)));
    const framesBefore = await t.deps.db.select({ n: clipFrames.frameNumber }).from(clipFrames).where(eq(clipFrames.clipId, before.clipRows[0].id));
    expect(framesBefore).toHaveLength(before.clipRows[0].frameCount);
    await seedDemo(t.deps.db, DEMO_STEPS);
    const after = await demoClips();
    expect(after.shotRows).toEqual(before.shotRows);
    expect(after.clipRows.map((c) => [c.id, c.updatedAt.toISOString(), c.framesPrefix])).toEqual(before.clipRows.map((c) => [c.id, c.updatedAt.toISOString(), c.framesPrefix]));
    expect((await storedKeys(t)).filter((f) => after.clipRows.some((c) => f.includes(c.id)))).toEqual(filesBefore);
  });
});
