import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let as: Record<'admin' | 'analyst' | 'tracker' | 'engineer' | 'viewer', Awaited<ReturnType<typeof signInAs>>>;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
  const sign = (role: Parameters<typeof demoPerson>[0]) => signInAs(t.app, demoPerson(role).email, DEMO_PASSWORD);
  as = { admin: await sign('admin'), analyst: await sign('analyst'), tracker: await sign('tracker'), engineer: await sign('engineer'), viewer: await sign('viewer') };
});
afterAll(() => t.close());

async function newTrack(clipId: string, kind: 'projectile' | 'muzzle' = 'projectile') {
  const res = await as.tracker.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: `Ball ${uniqueSuffix()}`, kind });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}
const marksOf = (trackId: string) => `/api/teams/${teamId}/tracks/${trackId}/marks`;

describe('tracks', () => {
  it('create, list with mark counts, rename, delete with marks', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    await newTrack(clipId, 'muzzle');
    await as.tracker.put(`${marksOf(trackId)}/3`).send({ uPx: 10, vPx: 20 });
    const list = await as.viewer.get(`/api/teams/${teamId}/clips/${clipId}/tracks`);
    expect(list.body.tracks.map((tr: { kind: string; markCount: number }) => [tr.kind, tr.markCount])).toEqual([
      ['projectile', 1],
      ['muzzle', 0],
    ]);
    const renamed = await as.analyst.patch(`/api/teams/${teamId}/tracks/${trackId}`).send({ name: 'Ball, second try' });
    expect(renamed.body).toMatchObject({ name: 'Ball, second try', markCount: 1 });
    expect((await as.admin.delete(`/api/teams/${teamId}/tracks/${trackId}`)).status).toBe(204);
    expectProblem(await as.viewer.get(marksOf(trackId)), 404);
  });

  it('viewers and engineers cannot create, rename or delete tracks', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    for (const role of ['viewer', 'engineer'] as const) {
      expectProblem(await as[role].post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: 'x' }), 403);
      expectProblem(await as[role].patch(`/api/teams/${teamId}/tracks/${trackId}`).send({ name: 'x' }), 403);
      expectProblem(await as[role].delete(`/api/teams/${teamId}/tracks/${trackId}`), 403);
    }
  });
});

describe('mark positions in seconds and metres', () => {
  it('world coordinates follow the current calibration (worked by hand)', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId, { captureFps: 1000, frameTimes: new Map([[12, 0.0125]]) });
    const trackId = await newTrack(clipId);
    const put = await as.tracker.put(`${marksOf(trackId)}/12`).send({ uPx: 300, vPx: 100, placedUPx: 301.5, placedVPx: 98, snapped: true });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    await as.tracker.put(`${marksOf(trackId)}/20`).send({ uPx: 50, vPx: 400 });

    const before = await as.viewer.get(marksOf(trackId));
    expect(before.body).toMatchObject({ calibrationId: null, calibrationVersion: null });
    expect(before.body.marks[0]).toMatchObject({ frameNumber: 12, xM: null, yM: null, snapped: true, placedUPx: 301.5, placedVPx: 98 });

    await as.analyst.post(`/api/teams/${teamId}/clips/${clipId}/calibrations`).send(SIMPLE_CALIBRATION);
    const after = await as.viewer.get(marksOf(trackId));
    expect(after.body.calibrationVersion).toBe(1);
    const [m12, m20] = after.body.marks;
    // 200 px/m, origin (100, 300), level: (300, 100) → ((300−100)/200, (300−100)/200) = (1.0, 1.0) m.
    expect(m12).toMatchObject({ frameNumber: 12, uPx: 300, vPx: 100, updatedBy: { displayName: demoPerson('tracker').displayName } });
    expect(m12.xM).toBeCloseTo(1.0, 12);
    expect(m12.yM).toBeCloseTo(1.0, 12);
    // Frame 12 has a stored time (the frame table knows of a late frame); frame 20 falls back to 20 / 1000 fps.
    expect(m12.tS).toBe(0.0125);
    expect(m20.tS).toBeCloseTo(0.02, 15);
    // (50, 400) → (−50/200, −100/200) = (−0.25, −0.5) m.
    expect(m20.xM).toBeCloseTo(-0.25, 12);
    expect(m20.yM).toBeCloseTo(-0.5, 12);

    // A new version (the reference was 2 m, not 1 m) re-expresses every mark: 100 px/m.
    await as.analyst.post(`/api/teams/${teamId}/clips/${clipId}/calibrations`).send({ ...SIMPLE_CALIBRATION, scale: { ...SIMPLE_CALIBRATION.scale, lengthM: 2 } });
    const v2 = await as.viewer.get(marksOf(trackId));
    expect(v2.body.calibrationVersion).toBe(2);
    expect(v2.body.marks[0].xM).toBeCloseTo(2.0, 12);
    expect(v2.body.marks[0].yM).toBeCloseTo(2.0, 12);
  });
});

describe('mark revisions', () => {
  it('create-only without expectedRevision; update with it; stale writes get 409 with the stored mark', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    const created = await as.tracker.put(`${marksOf(trackId)}/5`).send({ uPx: 10, vPx: 20 });
    expect(created.body).toMatchObject({ created: true, mark: { frameNumber: 5, uPx: 10, placedUPx: 10, snapped: false } });
    const r1 = created.body.mark.revision;
    expect(created.body.trackRevision).toBe(r1);

    const blind = await as.analyst.put(`${marksOf(trackId)}/5`).send({ uPx: 99, vPx: 99 });
    expectProblem(blind, 409);
    expect(blind.body.current).toMatchObject({ uPx: 10, vPx: 20, revision: r1, updatedBy: { displayName: demoPerson('tracker').displayName } });

    const moved = await as.analyst.put(`${marksOf(trackId)}/5`).send({ uPx: 11, vPx: 21, expectedRevision: r1 });
    expect(moved.status).toBe(200);
    expect(moved.body.created).toBe(false);
    const r2 = moved.body.mark.revision;
    expect(r2).toBeGreaterThan(r1);

    const stale = await as.tracker.put(`${marksOf(trackId)}/5`).send({ uPx: 12, vPx: 22, expectedRevision: r1 });
    expectProblem(stale, 409);
    expect(stale.body.current).toMatchObject({ uPx: 11, vPx: 21, revision: r2 });
    expect(stale.body.trackRevision).toBe(r2);

    const marks = await as.viewer.get(marksOf(trackId));
    expect(marks.body.marks).toHaveLength(1);
    expect(marks.body.marks[0]).toMatchObject({ uPx: 11, vPx: 21, revision: r2 });
    expect(marks.body.trackRevision).toBe(r2);
  });

  it('two writers on the same frame with the same expectedRevision: exactly one 200, one 409', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    const base = (await as.tracker.put(`${marksOf(trackId)}/7`).send({ uPx: 1, vPx: 1 })).body.mark.revision;
    for (let round = 0; round < 5; round++) {
      const current = (await as.viewer.get(marksOf(trackId))).body.marks[0].revision;
      const [a, b] = await Promise.all([
        as.tracker.put(`${marksOf(trackId)}/7`).send({ uPx: 100 + round, vPx: 1, expectedRevision: current }),
        as.analyst.put(`${marksOf(trackId)}/7`).send({ uPx: 200 + round, vPx: 1, expectedRevision: current }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const winner = a.status === 200 ? a : b;
      const loser = a.status === 200 ? b : a;
      // The loser is shown exactly what won.
      expect(loser.body.current).toEqual(winner.body.mark);
    }
    expect(base).toBeGreaterThan(0);
  });

  it('two first placements on an empty frame: one creates, the other sees it', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    const [a, b] = await Promise.all([
      as.tracker.put(`${marksOf(trackId)}/9`).send({ uPx: 1, vPx: 1 }),
      as.admin.put(`${marksOf(trackId)}/9`).send({ uPx: 2, vPx: 2 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
  });

  it('delete needs the current revision; a write over a deleted mark is stale', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    const r1 = (await as.tracker.put(`${marksOf(trackId)}/4`).send({ uPx: 1, vPx: 1 })).body.mark.revision;
    const r2 = (await as.tracker.put(`${marksOf(trackId)}/4`).send({ uPx: 2, vPx: 2, expectedRevision: r1 })).body.mark.revision;
    expectProblem(await as.analyst.delete(`${marksOf(trackId)}/4?expectedRevision=${r1}`), 409);
    expectProblem(await as.analyst.delete(`${marksOf(trackId)}/4`), 400);
    const ok = await as.analyst.delete(`${marksOf(trackId)}/4?expectedRevision=${r2}`);
    expect(ok.status).toBe(200);
    expect(ok.body.trackRevision).toBeGreaterThan(r2);
    expectProblem(await as.analyst.delete(`${marksOf(trackId)}/4?expectedRevision=${r2}`), 404);
    const revive = await as.tracker.put(`${marksOf(trackId)}/4`).send({ uPx: 3, vPx: 3, expectedRevision: r2 });
    expectProblem(revive, 409);
    expect(revive.body.current).toBeNull();
    expect((await as.viewer.get(marksOf(trackId))).body.marks).toEqual([]);
    // Re-created afterwards, the mark gets a revision never used before (no ABA).
    const again = await as.tracker.put(`${marksOf(trackId)}/4`).send({ uPx: 3, vPx: 3 });
    expect(again.body.mark.revision).toBeGreaterThan(r2);
  });

  it('frames outside the clip and bad bodies are 400', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId, { frameCount: 50 });
    const trackId = await newTrack(clipId);
    expectProblem(await as.tracker.put(`${marksOf(trackId)}/50`).send({ uPx: 1, vPx: 1 }), 400);
    expectProblem(await as.tracker.put(`${marksOf(trackId)}/-1`).send({ uPx: 1, vPx: 1 }), 400);
    expectProblem(await as.tracker.put(`${marksOf(trackId)}/3`).send({ uPx: 'a', vPx: 1 }), 400);
    expectProblem(await as.tracker.put(`${marksOf(trackId)}/3`).send({ uPx: 1, vPx: 1, placedUPx: 3 }), 400);
    expect((await as.viewer.get(marksOf(trackId))).body.marks).toEqual([]);
  });

  it('viewers and engineers read marks but cannot write them', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const trackId = await newTrack(clipId);
    const rev = (await as.tracker.put(`${marksOf(trackId)}/1`).send({ uPx: 1, vPx: 1 })).body.mark.revision;
    for (const role of ['viewer', 'engineer'] as const) {
      expect((await as[role].get(marksOf(trackId))).status).toBe(200);
      expectProblem(await as[role].put(`${marksOf(trackId)}/2`).send({ uPx: 1, vPx: 1 }), 403);
      expectProblem(await as[role].put(`${marksOf(trackId)}/1`).send({ uPx: 5, vPx: 5, expectedRevision: rev }), 403);
      expectProblem(await as[role].delete(`${marksOf(trackId)}/1?expectedRevision=${rev}`), 403);
      expectProblem(await as[role].post(`${marksOf(trackId)}/import`).send({ csv: 'frame,u_px,v_px\n3,1,1\n', kind: 'pixel' }), 403);
    }
    const marks = (await as.viewer.get(marksOf(trackId))).body.marks;
    expect(marks).toHaveLength(1);
    expect(marks[0]).toMatchObject({ uPx: 1, revision: rev });
  });
});
