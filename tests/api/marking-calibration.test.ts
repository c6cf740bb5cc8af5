import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

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

const calibrationsOf = (clipId: string) => `/api/teams/${teamId}/clips/${clipId}/calibrations`;

describe('calibration versions', () => {
  it('an uncalibrated clip has no current calibration', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const res = await as.viewer.get(`${calibrationsOf(clipId)}/current`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ calibration: null });
  });

  it('each POST stores the next version; the newest is current; all are listed', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const first = await as.analyst.post(calibrationsOf(clipId)).send(SIMPLE_CALIBRATION);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toMatchObject({ version: 1, pixelsPerMetre: 200, rollDeg: 0, downrange: 'right', plane: null, createdBy: { displayName: demoPerson('analyst').displayName } });
    // GUM: u_r = √((0.002/√3 / 1)² + (√2·0.5 / 200)²) = 0.00371932 (worked by hand in shared/geometry/scale-uncertainty.test.ts).
    expect(first.body.scaleRelUncertainty).toBeCloseTo(0.00371932, 7);

    const second = await as.admin.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, scale: { ...SIMPLE_CALIBRATION.scale, lengthM: 2 }, note: 'tape re-measured' });
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ version: 2, pixelsPerMetre: 100, note: 'tape re-measured' });

    const current = await as.engineer.get(`${calibrationsOf(clipId)}/current`);
    expect(current.body.calibration).toMatchObject({ id: second.body.id, version: 2 });
    const list = await as.viewer.get(calibrationsOf(clipId));
    expect(list.body.calibrations.map((c: { version: number }) => c.version)).toEqual([2, 1]);
  });

  it('concurrent calibrations get distinct consecutive versions', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const results = await Promise.all([as.analyst, as.admin, as.analyst, as.admin].map((a) => a.post(calibrationsOf(clipId)).send(SIMPLE_CALIBRATION)));
    expect(results.map((r) => r.status)).toEqual([201, 201, 201, 201]);
    expect(results.map((r) => r.body.version).sort()).toEqual([1, 2, 3, 4]);
  });

  it('stores a level line and a plane correction with its homography', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const res = await as.analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION,
      level: { kind: 'line', p1: { u: 0, v: 400 }, p2: { u: 600, v: 400 } },
      plane: { corners: [{ u: 100, v: 100 }, { u: 500, v: 110 }, { u: 490, v: 320 }, { u: 110, v: 300 }], widthM: 2, heightM: 1 },
      downrange: 'left',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.level).toEqual({ kind: 'line', p1: { u: 0, v: 400 }, p2: { u: 600, v: 400 } });
    expect(res.body.plane.homography).toHaveLength(9);
    expect(res.body.downrange).toBe('left');
  });

  it('rejects bad geometry with field paths and stores nothing', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    const same = await as.analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, scale: { ...SIMPLE_CALIBRATION.scale, p2: { u: 100.5, v: 500 } } });
    expectProblem(same, 400);
    expect(fieldPaths(same)).toContain('body.scale.p2');
    const tol = await as.analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, scale: { ...SIMPLE_CALIBRATION.scale, lengthTolM: 1.5 } });
    expectProblem(tol, 400);
    expect(fieldPaths(tol)).toContain('body.scale.lengthTolM');
    const negative = await as.analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, scale: { ...SIMPLE_CALIBRATION.scale, lengthM: -1 } });
    expectProblem(negative, 400);
    const collinear = await as.analyst.post(calibrationsOf(clipId)).send({
      ...SIMPLE_CALIBRATION,
      plane: { corners: [{ u: 100, v: 100 }, { u: 300, v: 100 }, { u: 500, v: 100 }, { u: 100, v: 300 }], widthM: 2, heightM: 1 },
    });
    expectProblem(collinear, 400);
    expect(fieldPaths(collinear)).toContain('body.plane.corners');
    const list = await as.analyst.get(calibrationsOf(clipId));
    expect(list.body.calibrations).toEqual([]);
  });

  it('only analysts and admins calibrate; everyone in the team reads', async () => {
    const clipId = await createMarkingClip(t, as.analyst, teamId);
    for (const role of ['tracker', 'engineer', 'viewer'] as const) {
      expectProblem(await as[role].post(calibrationsOf(clipId)).send(SIMPLE_CALIBRATION), 403);
    }
    for (const role of ['admin', 'analyst', 'tracker', 'engineer', 'viewer'] as const) {
      expect((await as[role].get(calibrationsOf(clipId))).status).toBe(200);
    }
  });

  it('an unknown clip is 404', async () => {
    expectProblem(await as.analyst.get(calibrationsOf(randomUUID())), 404);
    expectProblem(await as.analyst.post(calibrationsOf(randomUUID())).send(SIMPLE_CALIBRATION), 404);
  });
});
