// Team lens profiles: kept by the people who keep the kit, read by every member,
// refused with a plain 400 when the coefficients are not a lens, and copied into
// a calibration that names one (so a later edit changes no calibration version).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { LensProfile } from '../../shared/schemas/lens-profiles';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

type Agent = Awaited<ReturnType<typeof signInAs>>;
let t: TestApp;
let teamId: string;
let engineer: Agent;
let analyst: Agent;
let viewer: Agent;
let tracker: Agent;
const suffix = uniqueSuffix();
const profiles = () => `/api/teams/${teamId}/lens-profiles`;
const calibrationsOf = (clipId: string) => `/api/teams/${teamId}/clips/${clipId}/calibrations`;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
  engineer = await signInAs(t.app, demoPerson('engineer').email, DEMO_PASSWORD);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

const ACTION_CAM = {
  name: `Action cam wide ${suffix}`,
  cameraNote: '2.7K 120 fps, wide field of view',
  coefficients: { k1: -0.12, k2: 0.015, k1StdUnc: 0.004, k2StdUnc: 0.002, k1k2Correlation: -0.6 },
  frameWidthPx: 1280,
  frameHeightPx: 960,
};

const mine = async (who: Agent = viewer) => ((await who.get(profiles())).body as LensProfile[]).filter((p) => p.name.includes(suffix));

describe('lens profiles', () => {
  it('an engineer adds, changes and deletes one; every member reads it; a tracker or viewer may not write', async () => {
    const created = await engineer.post(profiles()).send(ACTION_CAM);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ ...ACTION_CAM, id: expect.any(String) });
    expect(await mine(viewer)).toEqual([created.body]);
    expect((await tracker.get(`${profiles()}/${created.body.id}`)).body).toEqual(created.body);

    const changed = await engineer.patch(`${profiles()}/${created.body.id}`).send({ cameraNote: null, coefficients: { k1: -0.1 } });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    // A new coefficients object replaces the old one whole; left-out parts take their stated defaults (0).
    expect(changed.body).toMatchObject({ cameraNote: null, coefficients: { k1: -0.1, k2: 0, k1StdUnc: 0, k2StdUnc: 0, k1k2Correlation: 0 } });

    expectProblem(await viewer.post(profiles()).send({ ...ACTION_CAM, name: `Viewer ${suffix}` }), 403);
    expectProblem(await tracker.patch(`${profiles()}/${created.body.id}`).send({ name: 'x' }), 403);
    expectProblem(await viewer.delete(`${profiles()}/${created.body.id}`), 403);

    expect((await engineer.delete(`${profiles()}/${created.body.id}`)).status).toBe(204);
    expectProblem(await viewer.get(`${profiles()}/${created.body.id}`), 404);
    expect(await mine()).toEqual([]);
  });

  it('refuses coefficients that are no lens, and sizes that are no frame, with a 400 naming the field; nothing is stored', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ coefficients: { ...ACTION_CAM.coefficients, k1: 'Infinity' } }, 'body.coefficients.k1'],
      [{ coefficients: { ...ACTION_CAM.coefficients, k1: 1e308 } }, 'body.coefficients.k1'],
      [{ coefficients: { ...ACTION_CAM.coefficients, k2: null } }, 'body.coefficients.k2'],
      [{ coefficients: { ...ACTION_CAM.coefficients, k1StdUnc: -0.01 } }, 'body.coefficients.k1StdUnc'],
      [{ coefficients: { ...ACTION_CAM.coefficients, k1k2Correlation: 1.5 } }, 'body.coefficients.k1k2Correlation'],
      // r_d = r (1 + k1 r²) with k1 = −0.5 peaks at r = √(2/3), where r_d = (2/3)^{3/2} ≈ 0.544 < 1 (closed form,
      // d r_d/dr = 1 + 3 k1 r² = 0): the picture folds back before its corners, which no lens does.
      [{ coefficients: { k1: -0.5, k2: 0 } }, 'body.coefficients.k1'],
      [{ frameWidthPx: 0 }, 'body.frameWidthPx'],
      [{ frameHeightPx: 720.5 }, 'body.frameHeightPx'],
      [{ name: '' }, 'body.name'],
    ];
    for (const [change, field] of cases) {
      const res = await engineer.post(profiles()).send({ ...ACTION_CAM, ...change });
      expectProblem(res, 400);
      expect(fieldPaths(res), JSON.stringify(change)).toContain(field);
    }
    const folding = await engineer.post(profiles()).send({ ...ACTION_CAM, coefficients: { k1: -0.5, k2: 0 } });
    expect(folding.body.detail).toMatch(/fold/);
    expect(await mine()).toEqual([]);

    const kept = await engineer.post(profiles()).send({ ...ACTION_CAM, name: `Kept ${suffix}` });
    expectProblem(await engineer.patch(`${profiles()}/${kept.body.id}`).send({ coefficients: { k1: -0.5 } }), 400);
    expect((await viewer.get(`${profiles()}/${kept.body.id}`)).body).toEqual(kept.body);
    await engineer.delete(`${profiles()}/${kept.body.id}`);
  });
});

describe('a calibration that names a lens profile', () => {
  it('copies its coefficients: the same correction as stating them, and a later edit of the profile changes no version', async () => {
    const profile = (await engineer.post(profiles()).send({ ...ACTION_CAM, name: `Calibrated ${suffix}` })).body as LensProfile;
    // The marking clip is 640×480: the same 4:3 shape as the profile's 1280×960, so the normalised coefficients carry over.
    const named = await createMarkingClip(t, analyst, teamId);
    const stated = await createMarkingClip(t, analyst, teamId);
    const byProfile = await analyst.post(calibrationsOf(named)).send({ ...SIMPLE_CALIBRATION, lens: { profileId: profile.id } });
    expect(byProfile.status, JSON.stringify(byProfile.body)).toBe(201);
    const byNumbers = await analyst.post(calibrationsOf(stated)).send({ ...SIMPLE_CALIBRATION, lens: { coefficients: ACTION_CAM.coefficients } });
    expect(byNumbers.status, JSON.stringify(byNumbers.body)).toBe(201);

    expect(byProfile.body.lens).toMatchObject({ source: 'profile', profile: { id: profile.id, name: profile.name }, ...ACTION_CAM.coefficients, frameWidthPx: 640, frameHeightPx: 480 });
    expect(byProfile.body.pixelsPerMetre).toBe(byNumbers.body.pixelsPerMetre);
    expect(byProfile.body.rollDeg).toBe(byNumbers.body.rollDeg);

    await engineer.patch(`${profiles()}/${profile.id}`).send({ coefficients: { k1: -0.2 } });
    const current = (await analyst.get(`${calibrationsOf(named)}/current`)).body.calibration;
    expect(current.version).toBe(byProfile.body.version);
    expect(current.lens.k1).toBe(-0.12);
    await engineer.delete(`${profiles()}/${profile.id}`);
    expect((await analyst.get(`${calibrationsOf(named)}/current`)).body.calibration.lens.k1).toBe(-0.12);
  });

  it('refuses a profile of another frame shape, an unknown profile, and two lens sources at once; nothing is stored', async () => {
    const wide = (await engineer.post(profiles()).send({ ...ACTION_CAM, name: `Sixteen-nine ${suffix}`, frameWidthPx: 1920, frameHeightPx: 1080 })).body as LensProfile;
    const clipId = await createMarkingClip(t, analyst, teamId);
    const shape = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, lens: { profileId: wide.id } });
    expectProblem(shape, 400);
    expect(fieldPaths(shape)).toEqual(['body.lens.profileId']);
    expect(shape.body.detail).toMatch(/1920×1080/);

    const unknown = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, lens: { profileId: '00000000-0000-4000-8000-000000000000' } });
    expectProblem(unknown, 400);
    expect(fieldPaths(unknown)).toEqual(['body.lens.profileId']);

    const both = await analyst.post(calibrationsOf(clipId)).send({ ...SIMPLE_CALIBRATION, lens: { profileId: wide.id, coefficients: ACTION_CAM.coefficients } });
    expectProblem(both, 400);
    expect(fieldPaths(both)).toEqual(['body.lens']);

    expect((await analyst.get(`${calibrationsOf(clipId)}/current`)).body).toEqual({ calibration: null });
    await engineer.delete(`${profiles()}/${wide.id}`);
  });
});
