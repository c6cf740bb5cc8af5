import { eq, and } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords';
import { auditEvents } from '../../server/db/schema/audit-events';
import { clips } from '../../server/db/schema/clips';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

type Agent = Awaited<ReturnType<typeof signInAs>>;

let t: TestApp;
let analyst: Agent;
let viewer: Agent;
let tracker: Agent;
let teamId: string;
const suffix = uniqueSuffix();

beforeAll(async () => {
  t = await createTestApp();
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  const me = await analyst.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;
});
afterAll(() => t.close());

// RFC 7807 §3: a problem document is application/problem+json with type, title, status, detail.
function expectProblem(res: request.Response, status: number) {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body).toMatchObject({ status, title: expect.any(String), detail: expect.any(String) });
}

const url = (path: string) => `/api/teams/${teamId}${path}`;

async function makeSeries(name: string) {
  const res = await analyst.post(url('/series')).send({ name, testDate: '2026-04-18', site: 'Wendlow Flats test field' });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

async function auditActions(targetId: string) {
  const rows = await t.deps.db.select({ action: auditEvents.action }).from(auditEvents).where(and(eq(auditEvents.teamId, teamId), eq(auditEvents.targetId, targetId)));
  return rows.map((r) => r.action).sort();
}

describe('series', () => {
  it('creates, reads, updates, lists and deletes, with audit entries', async () => {
    const name = `Series ${suffix}`;
    const created = await analyst.post(url('/series')).send({ name, testDate: '2026-04-18', site: ' Wendlow Flats ', notes: '' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name, testDate: '2026-04-18', site: 'Wendlow Flats', notes: null, shotCount: 0 });
    const id = created.body.id;

    expect((await viewer.get(url(`/series/${id}`))).body.name).toBe(name);
    const changed = await analyst.patch(url(`/series/${id}`)).send({ notes: 'gusty after 10:00' });
    expect(changed.status).toBe(200);
    expect(changed.body.notes).toBe('gusty after 10:00');

    const listed = await viewer.get(url('/series')).query({ q: suffix });
    expect(listed.body.map((s: { id: string }) => s.id)).toEqual([id]);

    expect((await analyst.delete(url(`/series/${id}`))).status).toBe(204);
    expectProblem(await viewer.get(url(`/series/${id}`)), 404);
    expect(await auditActions(id)).toEqual(['series.create', 'series.delete', 'series.update']);
  });

  it('rejects an impossible date with a field error', async () => {
    // 2026 is not a leap year (Gregorian rule), so 29 February does not exist.
    const res = await analyst.post(url('/series')).send({ name: `Bad date ${suffix}`, testDate: '2026-02-29' });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toContain('body.testDate');
  });

  it('refuses to delete a series that still has shots, and keeps both', async () => {
    const seriesId = await makeSeries(`Keep ${suffix}`);
    const shot = await analyst.post(url('/shots')).send({ seriesId, label: 'K1' });
    expect(shot.status).toBe(201);
    const res = await analyst.delete(url(`/series/${seriesId}`));
    expectProblem(res, 409);
    expect(res.body.shotCount).toBe(1);
    expect((await analyst.get(url(`/series/${seriesId}`))).status).toBe(200);
    expect((await analyst.get(url(`/shots/${shot.body.id}`))).status).toBe(200);
    // Once the shot is gone the series can go.
    expect((await analyst.delete(url(`/shots/${shot.body.id}`))).status).toBe(204);
    expect((await analyst.delete(url(`/series/${seriesId}`))).status).toBe(204);
  });
});

describe('launchers and projectiles', () => {
  it('CRUD a launcher in SI units, refuse delete while a shot uses it', async () => {
    const created = await analyst.post(url('/launchers')).send({
      name: `LT test ${suffix}`,
      boreM: 0.04,
      barrelLengthM: 0.6,
      chamberVolumeM3: 0.0015,
      maxWorkingPressurePa: 1.0e6,
      valveType: 'piston quick-exhaust',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ boreM: 0.04, chamberVolumeM3: 0.0015, maxWorkingPressurePa: 1e6 });
    const id = created.body.id;
    const patched = await analyst.patch(url(`/launchers/${id}`)).send({ boreM: null, notes: 'bore re-measured' });
    expect(patched.body).toMatchObject({ boreM: null, notes: 'bore re-measured' });

    const seriesId = await makeSeries(`Launcher use ${suffix}`);
    const shot = await analyst.post(url('/shots')).send({ seriesId, label: 'L1', launcherId: id });
    expectProblem(await analyst.delete(url(`/launchers/${id}`)), 409);
    await analyst.delete(url(`/shots/${shot.body.id}`));
    expect((await analyst.delete(url(`/launchers/${id}`))).status).toBe(204);
    expect(await auditActions(id)).toEqual(['launcher.create', 'launcher.delete', 'launcher.update']);
  });

  it('requires positive mass and diameter for a projectile', async () => {
    const res = await analyst.post(url('/projectiles')).send({ name: `P ${suffix}`, massKg: 0, diameterM: -0.01 });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['body.diameterM', 'body.massKg']);
    const ok = await analyst.post(url('/projectiles')).send({ name: `P ${suffix}`, massKg: 0.055, diameterM: 0.04, shape: 'blunt cylinder' });
    expect(ok.status).toBe(201);
    expect((await viewer.get(url('/projectiles'))).body.map((p: { id: string }) => p.id)).toContain(ok.body.id);
  });

  it('only analysts and admins edit them', async () => {
    expectProblem(await viewer.post(url('/launchers')).send({ name: 'nope' }), 403);
    expectProblem(await tracker.post(url('/projectiles')).send({ name: 'nope', massKg: 1, diameterM: 0.1 }), 403);
  });
});

describe('shots', () => {
  it('stores conditions exactly as given (SI) and joins names', async () => {
    const seriesId = await makeSeries(`Conditions ${suffix}`);
    const launcher = (await analyst.post(url('/launchers')).send({ name: `Cond launcher ${suffix}` })).body;
    const projectile = (await analyst.post(url('/projectiles')).send({ name: `Cond head ${suffix}`, massKg: 0.055, diameterM: 0.04 })).body;
    const body = {
      seriesId,
      launcherId: launcher.id,
      projectileId: projectile.id,
      label: 'C1',
      chamberPressurePa: 650_000,
      elevationDeg: 32.5,
      airTempC: 11.4,
      stationPressurePa: 100_870,
      relativeHumidityPct: 71,
      tapeRangeM: 61.3,
    };
    const res = await analyst.post(url('/shots')).send(body);
    expect(res.status).toBe(201);
    const { seriesId: _s, launcherId: _l, projectileId: _p, ...conditions } = body;
    expect(res.body).toMatchObject({ ...conditions, seriesName: `Conditions ${suffix}`, launcherName: launcher.name, projectileName: projectile.name, latestClip: null });
    const changed = await analyst.patch(url(`/shots/${res.body.id}`)).send({ elevationDeg: 30, notes: 'second attempt' });
    expect(changed.body).toMatchObject({ elevationDeg: 30, chamberPressurePa: 650_000, notes: 'second attempt' });
    expect(await auditActions(res.body.id)).toEqual(['shot.create', 'shot.update']);
  });

  it('rejects out-of-range conditions with one field error each', async () => {
    const seriesId = await makeSeries(`Bounds ${suffix}`);
    const res = await analyst.post(url('/shots')).send({
      seriesId,
      label: 'B1',
      chamberPressurePa: 6e7, // above the 50 MPa bound
      elevationDeg: 95, // past vertical
      relativeHumidityPct: 120, // RH is a percentage of saturation, 0..100 by definition
      stationPressurePa: 2e5, // twice sea-level standard (101 325 Pa, ISO 2533)
      airTempC: -80, // below our −60 °C bound for a test day
    });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { path: string }) => e.path).sort()).toEqual([
      'body.airTempC',
      'body.chamberPressurePa',
      'body.elevationDeg',
      'body.relativeHumidityPct',
      'body.stationPressurePa',
    ]);
    expect(res.body.errors.find((e: { path: string }) => e.path === 'body.elevationDeg').message).toMatch(/between -10 ° and 90 °/);
    const wrongType = await analyst.post(url('/shots')).send({ seriesId, label: 'B2', elevationDeg: '30' });
    expectProblem(wrongType, 400);
    // Nothing was stored by the rejected requests.
    expect((await analyst.get(url('/shots')).query({ seriesId })).body.total).toBe(0);
  });

  it('needs a series of this team; an unknown series is a field error', async () => {
    const res = await analyst.post(url('/shots')).send({ seriesId: '00000000-0000-4000-8000-000000000000', label: 'X' });
    expectProblem(res, 400);
    expect(res.body.errors).toEqual([{ path: 'body.seriesId', message: expect.stringMatching(/not a test series/) }]);
  });

  it('viewers and trackers read but cannot write', async () => {
    const seriesId = await makeSeries(`Roles ${suffix}`);
    expectProblem(await viewer.post(url('/shots')).send({ seriesId, label: 'V' }), 403);
    expectProblem(await tracker.post(url('/shots')).send({ seriesId, label: 'T' }), 403);
    expect((await viewer.get(url('/shots')).query({ seriesId })).status).toBe(200);
  });
});

describe('shots and their clips', () => {
  it('lists the newest clip status per shot and refuses to delete a shot that has clips', async () => {
    const seriesId = await makeSeries(`Clip status ${suffix}`);
    const shot = (await analyst.post(url('/shots')).send({ seriesId, label: 'CL1' })).body;
    const clipRow = (createdAt: Date, status: 'failed' | 'extracting', progress: number) => ({
      teamId,
      shotId: shot.id,
      originalName: `${status}.mp4`,
      sha256: `${suffix}-${status}`,
      sizeBytes: 1000,
      storageKey: `test/${suffix}/${status}`,
      formatName: 'mov,mp4,m4a,3gp,3g2,mj2',
      codec: 'h264',
      width: 320,
      height: 240,
      containerFps: 30,
      captureFps: 240,
      frameCount: 30,
      durationS: 1,
      inFrame: 0,
      outFrame: 29,
      status,
      progress,
      createdAt,
    });
    await t.deps.db.insert(clips).values([clipRow(new Date('2026-04-18T08:00:00Z'), 'failed', 0), clipRow(new Date('2026-04-18T08:05:00Z'), 'extracting', 0.5)]);
    const listed = await analyst.get(url('/shots')).query({ seriesId });
    expect(listed.body.items[0].latestClip).toMatchObject({ status: 'extracting', progress: 0.5, id: expect.any(String) });
    const res = await analyst.delete(url(`/shots/${shot.id}`));
    expectProblem(res, 409);
    expect(res.body.clipCount).toBe(2);
    expect((await analyst.get(url(`/shots/${shot.id}`))).status).toBe(200);
  });
});

describe('shot list: pagination, sorting, filtering', () => {
  let seriesId: string;
  let otherSeriesId: string;
  let launcherA: string;
  const elevations = [45, 10, 30, null, 60, 20, 5];

  beforeAll(async () => {
    seriesId = await makeSeries(`Paging ${suffix}`);
    otherSeriesId = await makeSeries(`Paging other ${suffix}`);
    launcherA = (await analyst.post(url('/launchers')).send({ name: `Paging A ${suffix}` })).body.id;
    for (const [i, elevationDeg] of elevations.entries()) {
      const res = await analyst.post(url('/shots')).send({
        seriesId,
        label: `P-${String(i + 1).padStart(2, '0')}`,
        elevationDeg,
        chamberPressurePa: 400_000 + i * 50_000,
        launcherId: i % 2 === 0 ? launcherA : null,
        notes: i === 3 ? `crosswind ${suffix}` : null,
      });
      expect(res.status).toBe(201);
    }
    await analyst.post(url('/shots')).send({ seriesId: otherSeriesId, label: 'O-1', elevationDeg: 1 });
  });

  const page = (query: Record<string, string | number>) => analyst.get(url('/shots')).query(query);

  it('pages through a sorted list without gaps or overlaps', async () => {
    const seen: (number | null)[] = [];
    for (let p = 1; p <= 3; p++) {
      const res = await page({ seriesId, sort: 'elevation', dir: 'asc', page: p, pageSize: 3 });
      expect(res.body).toMatchObject({ total: 7, page: p, pageSize: 3 });
      seen.push(...res.body.items.map((s: { elevationDeg: number | null }) => s.elevationDeg));
    }
    // Ascending numeric order, empty value last.
    expect(seen).toEqual([5, 10, 20, 30, 45, 60, null]);
    const desc = await page({ seriesId, sort: 'elevation', dir: 'desc', pageSize: 10 });
    expect(desc.body.items.map((s: { elevationDeg: number | null }) => s.elevationDeg)).toEqual([60, 45, 30, 20, 10, 5, null]);
  });

  it('sorts by label and pressure', async () => {
    const byLabel = await page({ seriesId, sort: 'label', dir: 'desc', pageSize: 2 });
    expect(byLabel.body.items.map((s: { label: string }) => s.label)).toEqual(['P-07', 'P-06']);
    const byPressure = await page({ seriesId, sort: 'pressure', dir: 'asc', pageSize: 1 });
    expect(byPressure.body.items[0].chamberPressurePa).toBe(400_000);
  });

  it('filters by series, launcher and text', async () => {
    expect((await page({ seriesId: otherSeriesId })).body.total).toBe(1);
    const withA = await page({ seriesId, launcherId: launcherA, pageSize: 50 });
    expect(withA.body.total).toBe(4);
    expect(withA.body.items.every((s: { launcherName: string }) => s.launcherName === `Paging A ${suffix}`)).toBe(true);
    const text = await page({ q: `crosswind ${suffix}` });
    expect(text.body.items.map((s: { label: string }) => s.label)).toEqual(['P-04']);
    // A series name matches too; LIKE wildcards in the search are literal.
    expect((await page({ q: `Paging other ${suffix}` })).body.total).toBe(1);
    expect((await page({ seriesId, q: '%' })).body.total).toBe(0);
  });

  it('rejects bad list parameters', async () => {
    const res = await page({ sort: 'colour', pageSize: 1000, page: 0 });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { path: string }) => e.path).sort()).toEqual(['query.page', 'query.pageSize', 'query.sort']);
  });
});

describe('cross-team isolation', () => {
  let outsider: Agent;
  let otherTeamId: string;
  let otherSeriesId: string;

  beforeAll(async () => {
    const email = `outsider-${suffix}@elsewhere.test`;
    const [team] = await t.deps.db.insert(teams).values({ name: `Other ${suffix}`, slug: `other-${suffix}` }).returning({ id: teams.id });
    const [user] = await t.deps.db.insert(users).values({ email, displayName: 'Outsider', passwordHash: await hashPassword(DEMO_PASSWORD) }).returning({ id: users.id });
    await t.deps.db.insert(memberships).values({ teamId: team.id, userId: user.id, role: 'admin' });
    otherTeamId = team.id;
    outsider = await signInAs(t.app, email, DEMO_PASSWORD);
    const s = await outsider.post(`/api/teams/${otherTeamId}/series`).send({ name: 'Their series', testDate: '2026-05-01' });
    expect(s.status).toBe(201);
    otherSeriesId = s.body.id;
  });

  it('a member of another team gets 403 on every record list and write', async () => {
    for (const path of ['/series', '/shots', '/launchers', '/projectiles']) {
      expectProblem(await outsider.get(url(path)), 403);
    }
    expectProblem(await outsider.post(url('/series')).send({ name: 'x', testDate: '2026-05-01' }), 403);
  });

  it('ids of another team are not found through our team, and cannot be referenced', async () => {
    expectProblem(await analyst.get(url(`/series/${otherSeriesId}`)), 404);
    expectProblem(await analyst.patch(url(`/series/${otherSeriesId}`)).send({ name: 'hijack' }), 404);
    const res = await analyst.post(url('/shots')).send({ seriesId: otherSeriesId, label: 'smuggled' });
    expectProblem(res, 400);
    expect(res.body.errors[0].path).toBe('body.seriesId');
    expect((await outsider.get(`/api/teams/${otherTeamId}/series/${otherSeriesId}`)).body.name).toBe('Their series');
  });
});
