// One unit per quantity: every pressure the API writes into words (cautions, refusals,
// air-density sources) is in kPa, as the pages, exports and PDF show it; never raw Pa.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Awaited<ReturnType<typeof signInAs>>;
let teamId: string;
const sfx = uniqueSuffix();
const url = (path: string) => `/api/teams/${teamId}${path}`;
const RAW_PA = /\d\s?Pa\b/;

let launcherId: string;
let projectileId: string;

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signInAs(t.app, demoPerson('engineer').email, DEMO_PASSWORD);
  const me = await engineer.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;
  launcherId = (await engineer.post(url('/launchers')).send({ name: `Units launcher ${sfx}`, boreM: 0.04, barrelLengthM: 0.6, chamberVolumeM3: 0.0015, maxWorkingPressurePa: 1.0e6, valveType: 'piston' })).body.id;
  projectileId = (await engineer.post(url('/projectiles')).send({ name: `Units head ${sfx}`, massKg: 0.055, diameterM: 0.04, shape: 'sphere' })).body.id;
});
afterAll(() => t.close());

const preset = (name: string, pressureMaxPa: number) => ({
  name,
  launcherId,
  projectileId,
  pressureMinPa: 4e5,
  pressureMaxPa,
  handbookBody: 'smooth sphere, subcritical',
  efficiency: 0.08,
  efficiencyStd: 0.04,
});

describe('pressures in words', () => {
  it('a preset above the launcher’s rating is refused with the rating in kPa', async () => {
    const res = await engineer.post(url('/presets')).send(preset(`Too high ${sfx}`, 2e6));
    expect(res.status).toBe(422);
    expect(res.body.detail).toContain('1000\u00a0kPa');
    expect(res.body.detail).not.toMatch(RAW_PA);
  });

  it('forecast cautions and the air-density source give pressures in kPa', async () => {
    const created = await engineer.post(url('/presets')).send(preset(`Units ${sfx}`, 9e5));
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const res = await engineer
      .post(url('/forecast'))
      .send({ presetId: created.body.id, pressurePa: 1.2e6, elevationDeg: 30, airTempC: 11, stationPressurePa: 101_300, relativeHumidityPct: 82, targetHeightM: 0, windMps: 0 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const cautions: string[] = res.body.cautions;
    expect(cautions.some((c) => c.includes('maximum working pressure (1000\u00a0kPa)'))).toBe(true);
    expect(cautions.some((c) => c.includes('400–900\u00a0kPa'))).toBe(true);
    for (const c of cautions) expect(c).not.toMatch(RAW_PA);
    expect(JSON.stringify(res.body)).not.toMatch(RAW_PA);
  });

  it('a pressure out of bounds is refused with its limits in kPa', async () => {
    const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
    const seriesId = (await analyst.post(url('/series')).send({ name: `Units series ${sfx}`, testDate: '2026-05-09' })).body.id;
    const res = await analyst.post(url('/shots')).send({ seriesId, label: 'U1', stationPressurePa: 2e5 });
    expect(res.status).toBe(400);
    const field = (res.body.errors as { path: string; message: string }[]).find((e) => e.path === 'body.stationPressurePa')!;
    // US Standard Atmosphere 1976 bounds of the form: 50 to 110 kPa.
    expect(field.message).toBe('must be between 50\u00a0kPa and 110\u00a0kPa');
    expect(res.body.detail).not.toMatch(RAW_PA);
  });
});
