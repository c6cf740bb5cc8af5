// Shot conditions (wind, launch height, air density stated directly) and clip
// exposure timing (shutter time, frame stamp): stored, read back, refused with
// a plain 400 that stores nothing, and used by the fit.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { encodeRawFrames } from '../../server/media/ffmpeg';
import type { ClipView } from '../../shared/schemas/clips';
import type { FitDetail } from '../../shared/schemas/fits';
import type { Shot } from '../../shared/schemas/records';
import { fixtureDir, uploadClip } from '../support/clips';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem, fieldPaths } from '../support/problem';
import { syntheticMarks } from '../support/synthetic-shot';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

type Agent = Awaited<ReturnType<typeof signInAs>>;
let t: TestApp;
let teamId: string;
let analyst: Agent;
let viewer: Agent;
const suffix = uniqueSuffix();
const url = (p: string) => `/api/teams/${teamId}${p}`;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

async function newSeries(): Promise<string> {
  const res = await analyst.post(url('/series')).send({ name: `Conditions ${suffix} ${uniqueSuffix()}`, testDate: '2026-06-03' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id;
}

describe('shot conditions on the shot record', () => {
  it('stores wind, launch height and a stated air density, and a viewer reads them back', async () => {
    const seriesId = await newSeries();
    const created = await analyst.post(url('/shots')).send({
      seriesId,
      label: `Windy ${suffix}`,
      wind: { speedMps: 4.5, fromDeg: 30 },
      launchHeightM: 1.2,
      airDensity: { densityKgM3: 1.17, tolKgM3: 0.01 },
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const read = (await viewer.get(url(`/shots/${created.body.id}`))).body as Shot;
    expect(read).toMatchObject({ wind: { speedMps: 4.5, fromDeg: 30 }, launchHeightM: 1.2, airDensity: { densityKgM3: 1.17, tolKgM3: 0.01 } });

    // A change of one leaves the others; null clears.
    const patched = await analyst.patch(url(`/shots/${created.body.id}`)).send({ wind: null, airDensity: { densityKgM3: 1.2 } });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    expect(patched.body).toMatchObject({ wind: null, launchHeightM: 1.2, airDensity: { densityKgM3: 1.2, tolKgM3: null } });

    // A shot that states none of them says so with nulls.
    const plain = await analyst.post(url('/shots')).send({ seriesId, label: `Calm ${suffix}` });
    expect(plain.body).toMatchObject({ wind: null, launchHeightM: null, airDensity: null });
  });

  it('refuses bad conditions with a 400 naming the field, and stores nothing', async () => {
    const seriesId = await newSeries();
    const shot = await analyst.post(url('/shots')).send({ seriesId, label: `Guarded ${suffix}`, wind: { speedMps: 2, fromDeg: 90 } });
    const before = (await analyst.get(url(`/shots/${shot.body.id}`))).body as Shot;
    const cases: [Record<string, unknown>, string][] = [
      [{ wind: { speedMps: -1, fromDeg: 0 } }, 'body.wind.speedMps'],
      [{ wind: { speedMps: 3, fromDeg: 360 } }, 'body.wind.fromDeg'],
      [{ wind: { speedMps: 3 } }, 'body.wind.fromDeg'],
      [{ launchHeightM: 1e6 }, 'body.launchHeightM'],
      // 5 kg/m³ is no air on Earth: the bounds follow from the temperature and pressure bounds (records.ts).
      [{ airDensity: { densityKgM3: 5 } }, 'body.airDensity.densityKgM3'],
      [{ airDensity: { densityKgM3: 1.2, tolKgM3: -0.1 } }, 'body.airDensity.tolKgM3'],
      [{ airDensity: { densityKgM3: '1.2' } }, 'body.airDensity.densityKgM3'],
    ];
    for (const [body, field] of cases) {
      const res = await analyst.patch(url(`/shots/${shot.body.id}`)).send(body);
      expectProblem(res, 400);
      expect(fieldPaths(res), JSON.stringify(body)).toContain(field);
      const bad = await analyst.post(url('/shots')).send({ seriesId, label: `Never ${suffix}`, ...body });
      expectProblem(bad, 400);
    }
    const after = (await analyst.get(url(`/shots/${shot.body.id}`))).body as Shot;
    expect(after).toEqual(before);
    const inSeries = await analyst.get(url('/shots')).query({ seriesId, pageSize: 100 });
    expect(inSeries.body.items.map((s: Shot) => s.label)).toEqual([`Guarded ${suffix}`]);
  });
});

describe('clip exposure timing', () => {
  it('is set by PATCH, shows the mid-exposure shift, and a shutter longer than the frame interval is a 400 that stores nothing', async () => {
    const clipId = await createMarkingClip(t, analyst, teamId, { captureFps: 240 });
    const fresh = (await analyst.get(url(`/clips/${clipId}`))).body as ClipView;
    expect(fresh).toMatchObject({ shutterS: null, frameStamp: 'middle', exposureShiftS: 0 });

    const set = await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS: 1 / 1000, frameStamp: 'start' });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    // Stamped at the start of a 1 ms exposure, the blur's centre is 0.5 ms later (exposure-timing.ts).
    expect(set.body).toMatchObject({ shutterS: 0.001, frameStamp: 'start' });
    expect(set.body.exposureShiftS).toBeCloseTo(0.0005, 12);
    const end = await analyst.patch(url(`/clips/${clipId}`)).send({ frameStamp: 'end' });
    expect(end.body.exposureShiftS).toBeCloseTo(-0.0005, 12);

    // 240 fps leaves 4.17 ms between frames; a 5 ms exposure cannot belong to it.
    const tooLong = await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS: 0.005 });
    expectProblem(tooLong, 400);
    expect(fieldPaths(tooLong)).toEqual(['body.shutterS']);
    expect(tooLong.body.detail).toMatch(/shutter time .* longer than the .* between frames/);
    // Nor does a new capture rate that leaves the stored 1 ms too long (1000 fps: 1 ms between frames is fine; 2000 fps is not).
    const fasterRate = await analyst.patch(url(`/clips/${clipId}`)).send({ captureFps: 2000 });
    expectProblem(fasterRate, 400);
    expect(fieldPaths(fasterRate)).toEqual(['body.captureFps']);
    // Both in one body: the schema checks them together.
    const together = await analyst.patch(url(`/clips/${clipId}`)).send({ captureFps: 1000, shutterS: 0.002 });
    expectProblem(together, 400);
    expect(fieldPaths(together)).toEqual(['body.shutterS']);
    for (const shutterS of [0, -0.001, 2, 'fast']) {
      const res = await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS });
      expectProblem(res, 400);
      expect(fieldPaths(res)).toEqual(['body.shutterS']);
    }
    expectProblem(await analyst.patch(url(`/clips/${clipId}`)).send({ frameStamp: 'halfway' }), 400);

    const after = (await analyst.get(url(`/clips/${clipId}`))).body as ClipView;
    expect(after).toMatchObject({ captureFps: 240, shutterS: 0.001, frameStamp: 'end' });
    // null clears the shutter time.
    const cleared = await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS: null });
    expect(cleared.body).toMatchObject({ shutterS: null, exposureShiftS: 0 });
    expectProblem(await viewer.patch(url(`/clips/${clipId}`)).send({ shutterS: 0.001 }), 403);
  });

  it('is taken at upload; a shutter longer than the frame interval refuses the upload and keeps no clip', async () => {
    const dir = fixtureDir('exposure');
    const file = path.join(dir, 'tiny.mp4');
    const enc = encodeRawFrames({ outFile: file, width: 64, height: 48, pixFmt: 'gray', fps: 30, outputArgs: ['-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p'] });
    for (let i = 0; i < 3; i++) await enc.write(Buffer.alloc(64 * 48, 90 + i * 30));
    await enc.finish();
    const seriesId = await newSeries();
    const shot = await analyst.post(url('/shots')).send({ seriesId, label: `Upload ${suffix}` });
    const clipsOf = url(`/shots/${shot.body.id}/clips`);

    const refused = await uploadClip(analyst, teamId, shot.body.id, file, { captureFps: 240, shutterS: '0.01' });
    expectProblem(refused, 400);
    expect(fieldPaths(refused)).toEqual(['body.shutterS']);
    expect((await analyst.get(clipsOf)).body).toEqual([]);

    const taken = await uploadClip(analyst, teamId, shot.body.id, file, { captureFps: 240, shutterS: '0.002', frameStamp: 'start' });
    expect(taken.status, JSON.stringify(taken.body)).toBe(201);
    expect(taken.body).toMatchObject({ shutterS: 0.002, frameStamp: 'start' });
    expect(taken.body.exposureShiftS).toBeCloseTo(0.001, 12);
  });
});

describe('the fit uses the shot conditions and the exposure timing', () => {
  // A known shot (shared/physics/flight.ts, integrated to 1e-12), filmed at 240 fps, placed in pixels
  // through SIMPLE_CALIBRATION: 200 px per metre, origin (100, 300), level, downrange to the right.
  const FPS = 240;
  const truth = { speedMps: 10, angleDeg: 30, dragK_perM: 0.12, frameRateHz: FPS, markCount: 60, noiseM: 0.002, seed: 12, x0M: 0, y0M: 0 };
  let clipId: string;
  let shotId: string;
  let trackId: string;
  let base: FitDetail;

  async function runFit(): Promise<FitDetail> {
    const res = await analyst.post(url(`/tracks/${trackId}/fits`));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body as FitDetail;
  }

  beforeAll(async () => {
    clipId = await createMarkingClip(t, analyst, teamId, { captureFps: FPS });
    shotId = ((await analyst.get(url(`/clips/${clipId}`))).body as ClipView).shotId;
    const projectile = await analyst.post(url('/projectiles')).send({ name: `Foam ${suffix}`, massKg: 0.05, diameterM: 0.1 });
    expect(projectile.status).toBe(201);
    // Dry air at 20 °C and 101325 Pa: 1.2041 kg/m³ (US Standard Atmosphere 1976 gas constants; air-conditions.test.ts).
    const set = await analyst.patch(url(`/shots/${shotId}`)).send({ projectileId: projectile.body.id, airTempC: 20, stationPressurePa: 101325, relativeHumidityPct: 0 });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    const cal = await analyst.post(url(`/clips/${clipId}/calibrations`)).send(SIMPLE_CALIBRATION);
    expect(cal.status, JSON.stringify(cal.body)).toBe(201);
    const track = await analyst.post(url(`/clips/${clipId}/tracks`)).send({ name: 'Ball', kind: 'projectile' });
    trackId = track.body.id;
    const marks = syntheticMarks(truth);
    for (const [frameNumber, m] of marks.entries()) {
      const res = await analyst.put(url(`/tracks/${trackId}/marks/${frameNumber}`)).send({ uPx: 100 + 200 * m.xM, vPx: 300 - 200 * m.yM });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    }
    base = await runFit();
    expect(base.result.dragResolved, base.result.dragVerdict).toBe(true);
    expect(base.snapshot.fitInput.exposureShiftS).toBeUndefined();
    expect(base.snapshot.fitInput.windXMps).toBeUndefined();
  });

  it('shifts mark times to mid-exposure, states the shift, and changes the input hash', async () => {
    await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS: 1 / 500, frameStamp: 'start' });
    const fit = await runFit();
    // Stamped at the start of a 2 ms exposure: +1 ms (midExposureShiftS, exposure-timing.ts).
    expect(fit.result.exposureShiftS).toBeCloseTo(0.001, 12);
    expect(fit.snapshot.fitInput.exposureShiftS).toBeCloseTo(0.001, 12);
    expect(fit.snapshot.clip).toMatchObject({ shutterS: 0.002, frameStamp: 'start' });
    expect(fit.inputHash).not.toBe(base.inputHash);
    // Every time moves by the same 1 ms, so the launch state is the same place and speed, 1 ms later on the clock.
    expect(fit.result.tRefS - base.result.tRefS).toBeCloseTo(0.001, 9);
    expect(fit.result.launchSpeedMps.value).toBeCloseTo(base.result.launchSpeedMps.value, 6);
    await analyst.patch(url(`/clips/${clipId}`)).send({ shutterS: null, frameStamp: 'middle' });
  });

  it('takes the along-plane wind: a headwind lowers the fitted Cd, a pure crosswind changes nothing', async () => {
    await analyst.patch(url(`/shots/${shotId}`)).send({ wind: { speedMps: 4, fromDeg: 0 } });
    const head = await runFit();
    // From the line of fire at 0°: a headwind, w_x = −s cos φ = −4 m/s (wind.ts).
    expect(head.snapshot.fitInput.windXMps).toBeCloseTo(-4, 12);
    expect(head.snapshot.shot.wind).toEqual({ speedMps: 4, fromDeg: 0 });
    expect(head.inputHash).not.toBe(base.inputHash);
    // The same observed deceleration against a faster relative airflow (|v − w| > |v|) takes less drag per unit
    // of dynamic pressure: a = −k |v − w| (v − w). The truth was still air, so Cd drops.
    expect(head.result.dragCoefficient.value).toBeLessThan(base.result.dragCoefficient.value * 0.95);

    await analyst.patch(url(`/shots/${shotId}`)).send({ wind: { speedMps: 4, fromDeg: 90 } });
    const cross = await runFit();
    expect(cross.snapshot.fitInput.windXMps).toBe(0);
    expect(cross.result.dragCoefficient.value).toBeCloseTo(base.result.dragCoefficient.value, 9);
    await analyst.patch(url(`/shots/${shotId}`)).send({ wind: null });
  });

  it('uses an air density stated directly instead of the weather readings, with its tolerance as the density row', async () => {
    await analyst.patch(url(`/shots/${shotId}`)).send({ airDensity: { densityKgM3: 1.0, tolKgM3: 0.03 } });
    const fit = await runFit();
    expect(fit.snapshot.fitInput.airDensityKgM3).toBe(1.0);
    expect(fit.snapshot.air.source).toMatch(/stated directly/);
    // ±0.03 kg/m³ rectangular: u = 0.03/√3 (GUM JCGM 100:2008 §4.3.7).
    expect(fit.snapshot.uncertainties.airDensityKgM3.value).toBeCloseTo(0.03 / Math.sqrt(3), 12);
    // The fitted drag constant k = ρ Cd A / (2 m) does not depend on ρ, so Cd scales as 1/ρ: 1.2041/1.0.
    expect(fit.result.dragK_perM.value).toBeCloseTo(base.result.dragK_perM.value, 6);
    expect(fit.result.dragCoefficient.value / base.result.dragCoefficient.value).toBeCloseTo(base.snapshot.air.densityKgM3 / 1.0, 4);
    expect(base.snapshot.air.densityKgM3).toBeCloseTo(1.20412, 4);
  });

  it('cautions that the scale reference is assumed to lie in the flight plane when no offset was stated', () => {
    expect(base.result.cautions.some((c) => /assumed to lie in the flight plane/.test(c))).toBe(true);
  });
});
