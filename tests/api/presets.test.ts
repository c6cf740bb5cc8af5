// Design presets through the real API and database: version 1 from a handbook
// value, versions pooled from approved fits with provenance and diffs, the
// approved-only rule, forecasts equal to the physics core, and a keep-out
// distance that grows when the drag interval widens.
import { and, eq } from 'drizzle-orm';
import { sum, weightedMean } from 'simple-statistics';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fits } from '../../server/db/schema/fits';
import { launchers, projectiles } from '../../server/db/schema/records';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { DEMO_PRESET_NAMES } from '../../server/seed/demo-presets';
import { createSimulatedApprovedFit, type SimulatedShotSpec } from '../../server/seed/simulated-fits';
import { humidAirDensityKgM3 } from '../../shared/physics/air';
import { STANDARD_GRAVITY_MPS2 } from '../../shared/physics/constants';
import { dragKFromCd } from '../../shared/physics/flight';
import { bestElevationForRange, forecastShot, vacuumForecast } from '../../shared/physics/forecast';
import { adiabaticSpeed } from '../../shared/physics/launcher';
import type { FitCandidate, ForecastResponse, KeepOutResponse, PresetDetail, PresetVersion } from '../../shared/schemas/presets';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

type Agent = Awaited<ReturnType<typeof signInAs>>;

let t: TestApp;
let engineer: Agent;
let analyst: Agent;
let viewer: Agent;
let teamId: string;
const sfx = uniqueSuffix();
const url = (path: string) => `/api/teams/${teamId}${path}`;

// A launcher like the demo OL-40 and a 55 g, 40 mm head; the day's air.
const LAUNCHER = { name: `Preset test launcher ${sfx}`, boreM: 0.04, barrelLengthM: 0.6, chamberVolumeM3: 0.0015, maxWorkingPressurePa: 1.0e6, valveType: 'piston' };
const PROJECTILE = { name: `Preset test head ${sfx}`, massKg: 0.055, diameterM: 0.04, shape: 'sphere' };
const DAY = { airTempC: 11, stationPressurePa: 101_300, relativeHumidityPct: 82 };

let launcherId: string;
let projectileId: string;
let otherProjectileId: string;
let seriesId: string;
let presetId: string;
const agreeing: string[] = [];
const discordant: string[] = [];
let awaitingFitId: string;
let otherProjectileFitId: string;

async function simulatedFit(spec: Omit<SimulatedShotSpec, 'label'> & { label?: string }, projectile = projectileId) {
  const db = t.deps.db;
  const [launcher] = await db.select().from(launchers).where(eq(launchers.id, launcherId));
  const [proj] = await db.select().from(projectiles).where(eq(projectiles.id, projectile));
  const engineerRow = await engineer.get('/api/auth/me');
  const { fitId } = await createSimulatedApprovedFit(db, {
    teamId,
    seriesId,
    launcher,
    projectile: proj,
    reviewerId: engineerRow.body.user?.id ?? engineerRow.body.id ?? null,
    spec: { label: spec.label ?? `P-${uniqueSuffix()}`, ...DAY, ...spec },
  });
  return fitId;
}

beforeAll(async () => {
  t = await createTestApp();
  engineer = await signInAs(t.app, demoPerson('engineer').email, DEMO_PASSWORD);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  const me = await engineer.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;

  // Engineers may now keep the kit records (CAN.editEquipment).
  const l = await engineer.post(url('/launchers')).send(LAUNCHER);
  expect(l.status, JSON.stringify(l.body)).toBe(201);
  launcherId = l.body.id;
  const p = await engineer.post(url('/projectiles')).send(PROJECTILE);
  expect(p.status, JSON.stringify(p.body)).toBe(201);
  projectileId = p.body.id;
  const q = await engineer.post(url('/projectiles')).send({ ...PROJECTILE, name: `Other head ${sfx}` });
  otherProjectileId = q.body.id;
  const s = await analyst.post(url('/series')).send({ name: `Preset series ${sfx}`, testDate: '2026-05-09' });
  expect(s.status, JSON.stringify(s.body)).toBe(201);
  seriesId = s.body.id;

  // Three shots of one head (true Cd 0.82, energy efficiency 5 %) and two that disagree (0.72 and 0.92).
  for (const [i, P] of [5.5e5, 6.5e5, 7.5e5].entries()) agreeing.push(await simulatedFit({ chamberPressurePa: P, elevationDeg: 25 + 5 * i, trueDragCoefficient: 0.82, trueEfficiency: 0.05, seed: 900 + i }));
  discordant.push(await simulatedFit({ chamberPressurePa: 6e5, elevationDeg: 30, trueDragCoefficient: 0.72, trueEfficiency: 0.05, seed: 910 }));
  discordant.push(await simulatedFit({ chamberPressurePa: 6e5, elevationDeg: 30, trueDragCoefficient: 0.92, trueEfficiency: 0.05, seed: 911 }));
  awaitingFitId = await simulatedFit({ chamberPressurePa: 6e5, elevationDeg: 30, trueDragCoefficient: 0.82, trueEfficiency: 0.05, seed: 920 });
  await t.deps.db.update(fits).set({ state: 'awaiting-review', reviewedAt: null, reviewedBy: null }).where(eq(fits.id, awaitingFitId));
  otherProjectileFitId = await simulatedFit({ chamberPressurePa: 6e5, elevationDeg: 30, trueDragCoefficient: 0.82, trueEfficiency: 0.05, seed: 930 }, otherProjectileId);
});
afterAll(() => t.close());

describe('creating a preset', () => {
  it('starts at version 1 from the handbook sphere value (0.47, Hoerner) and a stated efficiency assumption', async () => {
    const res = await engineer.post(url('/presets')).send({
      name: `Preset ${sfx}`,
      launcherId,
      projectileId,
      pressureMinPa: 4e5,
      pressureMaxPa: 9e5,
      handbookBody: 'smooth sphere, subcritical',
      efficiency: 0.08,
      efficiencyStd: 0.04,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const detail = res.body as PresetDetail;
    presetId = detail.id;
    expect(detail.versions).toHaveLength(1);
    const v1 = detail.versions[0];
    // Hoerner, Fluid-Dynamic Drag (1965): smooth sphere below the drag crisis, Cd ≈ 0.47.
    expect(v1.dragCoefficient).toBe(0.47);
    expect(v1.dragSource).toMatch(/handbook: smooth sphere.*0\.47.*Hoerner/);
    expect(v1.efficiencySource).toMatch(/^assumption: 0\.08 ± 0\.04/);
    expect(v1.efficiency).toBe(0.08);
    expect(v1.launcherModel).toBe('adiabatic');
    expect(v1.publishedBy?.displayName).toBe(demoPerson('engineer').displayName);
    expect(v1.diff.fromVersion).toBeNull();
  });

  it('refuses a viewer (403) and a preset above the launcher’s maximum working pressure (422)', async () => {
    const body = { name: `Preset x ${sfx}`, launcherId, projectileId, pressureMinPa: 4e5, pressureMaxPa: 9e5 };
    expectProblem(await viewer.post(url('/presets')).send(body), 403);
    expectProblem(await engineer.post(url('/presets')).send({ ...body, pressureMaxPa: 2e6 }), 422);
    expectProblem(await engineer.post(url('/presets')).send({ ...body, name: `Preset ${sfx}` }), 409);
  });
});

describe('kit named by a preset', () => {
  it('cannot be deleted while the preset uses it (409), and nothing is lost', async () => {
    const l = await engineer.post(url('/launchers')).send({ ...LAUNCHER, name: `Kept launcher ${sfx}` });
    const p = await engineer.post(url('/projectiles')).send({ ...PROJECTILE, name: `Kept head ${sfx}` });
    const preset = await engineer.post(url('/presets')).send({ name: `Kept preset ${sfx}`, launcherId: l.body.id, projectileId: p.body.id, pressureMinPa: 4e5, pressureMaxPa: 9e5 });
    expect(preset.status, JSON.stringify(preset.body)).toBe(201);
    const dl = await engineer.delete(url(`/launchers/${l.body.id}`));
    expectProblem(dl, 409);
    expect(dl.body.detail).toMatch(/design preset/);
    expectProblem(await engineer.delete(url(`/projectiles/${p.body.id}`)), 409);
    expect((await viewer.get(url(`/presets/${preset.body.id}`))).status).toBe(200);
  });
});

describe('publishing versions from approved fits', () => {
  it('lists only approved fits of the preset’s launcher and projectile as candidates', async () => {
    const res = await viewer.get(url(`/presets/${presetId}/candidates`));
    expect(res.status).toBe(200);
    const ids = (res.body as FitCandidate[]).map((c) => c.fitId).sort();
    expect(ids).toEqual([...agreeing, ...discordant].sort());
  });

  it('pools to the inverse-variance mean computed directly with simple-statistics', async () => {
    const candidates = (await viewer.get(url(`/presets/${presetId}/candidates`))).body as FitCandidate[];
    const chosen = candidates.filter((c) => agreeing.includes(c.fitId));
    const w = chosen.map((c) => 1 / c.dragCoefficient!.stdErr ** 2);
    const res = await engineer.post(url(`/presets/${presetId}/pool-preview`)).send({ fitIds: agreeing });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.dragCoefficient.value).toBeCloseTo(weightedMean(chosen.map((c) => c.dragCoefficient!.value), w), 12);
    expect(res.body.dragCoefficient.stdErrFixed).toBeCloseTo(1 / Math.sqrt(sum(w)), 12);
    // The simulated flights had Cd 0.82; the pooled value must find it within its interval.
    expect(Math.abs(res.body.dragCoefficient.value - 0.82)).toBeLessThan(3 * res.body.dragCoefficient.stdErr + 0.005);
    expect(res.body.efficiency.value).toBeCloseTo(0.05, 2);
  });

  it('publishes version 2 with provenance (which fits, who, when) and a diff against version 1', async () => {
    const res = await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: agreeing, note: 'three agreeing shots' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const v2 = res.body as PresetVersion;
    expect(v2.version).toBe(2);
    expect([...v2.pooledFitIds].sort()).toEqual([...agreeing].sort());
    expect(v2.dragSource).toBe('pooled from 3 approved fits (inverse-variance weighted mean)');
    expect(v2.publishedBy?.displayName).toBe(demoPerson('engineer').displayName);
    expect(Date.parse(v2.publishedAt)).not.toBeNaN();
    expect(v2.note).toBe('three agreeing shots');
    expect(v2.heterogeneity?.dragCoefficient?.count).toBe(3);
    expect(v2.diff.fromVersion).toBe(1);
    const cdRow = v2.diff.rows.find((r) => r.field === 'dragCoefficient')!;
    expect(cdRow.before).toBe(0.47);
    expect(cdRow.after).toBe(v2.dragCoefficient);
    expect(cdRow.change).toBeCloseTo(v2.dragCoefficient - 0.47, 12);
    expect([...v2.diff.fitsAdded].sort()).toEqual([...agreeing].sort());

    const diff = await viewer.get(url(`/presets/${presetId}/versions/2/diff`));
    expect(diff.status).toBe(200);
    expect(diff.body).toEqual(v2.diff);
    // Each pooled fit remembers the version it went into.
    const comparisons = await viewer.get(url(`/fits/${agreeing[0]}/preset-comparisons`));
    expect(comparisons.body).toEqual([expect.objectContaining({ presetId, version: 2, role: 'pooled' })]);
  });

  it('keeps version 1 readable after version 2 is published', async () => {
    const res = await viewer.get(url(`/presets/${presetId}/versions/1`));
    expect(res.status).toBe(200);
    expect(res.body.dragCoefficient).toBe(0.47);
    expect(res.body.dragSource).toMatch(/Hoerner/);
    expectProblem(await viewer.get(url(`/presets/${presetId}/versions/99`)), 404);
  });

  it('accepts only approved fits of this launcher and projectile, and changes nothing otherwise', async () => {
    expectProblem(await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: [agreeing[0], awaitingFitId] }), 409);
    expectProblem(await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: [otherProjectileFitId] }), 422);
    expectProblem(await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: ['00000000-0000-4000-8000-000000000000'] }), 422);
    expectProblem(await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: [] }), 400);
    expectProblem(await analyst.post(url(`/presets/${presetId}/versions`)).send({ fitIds: agreeing }), 403);
    const detail = (await viewer.get(url(`/presets/${presetId}`))).body as PresetDetail;
    expect(detail.versions.map((v) => v.version)).toEqual([1, 2]);
  });
});

describe('forecast', () => {
  it('equals the physics core’s numbers for the same inputs', async () => {
    const body = { presetId, version: 2, pressurePa: 6e5, elevationDeg: 30, ...DAY, targetHeightM: 0, windMps: 0 };
    const res = await viewer.post(url('/forecast')).send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const f = res.body as ForecastResponse;
    const v2 = (await viewer.get(url(`/presets/${presetId}/versions/2`))).body as PresetVersion;
    // Direct from shared/physics: adiabatic launcher model, energy efficiency → speed × √η, humid-air density, k from Cd.
    const model = adiabaticSpeed({ gaugePressurePa: 6e5, boreDiameterM: 0.04, barrelLengthM: 0.6, massKg: 0.055, chamberVolumeM3: 0.0015, atmosphericPressurePa: DAY.stationPressurePa }).speedMps;
    const speed = model * Math.sqrt(v2.efficiency);
    const rho = humidAirDensityKgM3({ temperatureC: DAY.airTempC, pressurePa: DAY.stationPressurePa, relativeHumidity: DAY.relativeHumidityPct / 100 });
    const k = dragKFromCd(v2.dragCoefficient, 0.04, 0.055, rho);
    const direct = forecastShot({ speedMps: speed, angleDeg: 30, dragK_perM: k });
    const best = bestElevationForRange({ speedMps: speed, dragK_perM: k });
    expect(f.muzzleSpeedMps).toBeCloseTo(speed, 10);
    expect(f.air.densityKgM3).toBeCloseTo(rho, 12);
    expect(f.withDrag.rangeM!).toBeCloseTo(direct.rangeM!, 9);
    expect(f.withDrag.apexHeightM).toBeCloseTo(direct.apexHeightM, 9);
    expect(f.withDrag.timeOfFlightS!).toBeCloseTo(direct.timeOfFlightS!, 9);
    expect(f.withDrag.impactSpeedMps!).toBeCloseTo(direct.impactSpeedMps!, 9);
    expect(f.withDrag.impactAngleDeg!).toBeCloseTo(direct.impactAngleDeg!, 9);
    expect(f.bestElevation.angleDeg).toBeCloseTo(best.angleDeg, 6);
    // Vacuum closed form: R = v² sin 2θ / g.
    expect(f.vacuum.rangeM!).toBeCloseTo((speed ** 2 * Math.sin(Math.PI / 3)) / STANDARD_GRAVITY_MPS2, 9);
    expect(f.vacuum.rangeM!).toBeCloseTo(vacuumForecast({ speedMps: speed, angleDeg: 30, dragK_perM: 0 }).rangeM!, 9);
    // Sweep and band are there, and the band brackets the nominal range.
    expect(f.sweep.map((r) => r.elevationDeg)).toEqual([5, 10, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75, 80]);
    expect(f.sweep.find((r) => r.elevationDeg === 30)!.rangeM!).toBeCloseTo(direct.rangeM!, 9);
    expect(f.band.method).toMatch(/Monte Carlo.*seed/);
    expect(f.band.rangeM!.low).toBeLessThan(direct.rangeM!);
    expect(f.band.rangeM!.high).toBeGreaterThan(direct.rangeM!);
    expect(f.trajectories.drag.length).toBeGreaterThan(10);
    expect(f.trajectories.vacuum.at(-1)!.xM).toBeCloseTo(f.vacuum.rangeM!, 6);
  });

  it('follows the version asked for: version 1 and version 2 forecast differently', async () => {
    const body = { presetId, pressurePa: 6e5, elevationDeg: 30, ...DAY };
    const v1 = (await viewer.post(url('/forecast')).send({ ...body, version: 1 })).body as ForecastResponse;
    const latest = (await viewer.post(url('/forecast')).send(body)).body as ForecastResponse;
    expect(v1.version.version).toBe(1);
    expect(latest.version.version).toBe(2);
    expect(latest.withDrag.rangeM).not.toBeCloseTo(v1.withDrag.rangeM!, 1);
  });

  it('rejects a forecast with an unknown preset (404) or bad conditions (400)', async () => {
    expectProblem(await viewer.post(url('/forecast')).send({ presetId: '00000000-0000-4000-8000-000000000000', pressurePa: 6e5, elevationDeg: 30 }), 404);
    expectProblem(await viewer.post(url('/forecast')).send({ presetId, pressurePa: 6e5, elevationDeg: 95 }), 400);
  });
});

describe('keep-out distance', () => {
  it('is the worst-case range times the safety factor, below the vacuum ceiling v²/g', async () => {
    const res = await viewer.get(url(`/presets/${presetId}/keep-out?version=2`));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const k = res.body as KeepOutResponse;
    const v2 = (await viewer.get(url(`/presets/${presetId}/versions/2`))).body as PresetVersion;
    expect(k.maxWorkingPressurePa).toBe(1.0e6);
    expect(k.efficiencyUpper).toBeCloseTo(Math.min(1, v2.efficiency + 2 * v2.efficiencyStd), 12);
    expect(k.dragCoefficientLower).toBeCloseTo(v2.dragCoefficient - 2 * v2.dragCoefficientStd, 12);
    expect(k.keepOutM).toBeCloseTo(k.maxRangeM * k.safetyFactor, 9);
    expect(k.safetyFactor).toBe(1.5);
    // No drag and no losses can only carry further: v²/g at 45° (closed form).
    expect(k.vacuumCeilingM).toBeCloseTo(k.modelSpeedMps ** 2 / STANDARD_GRAVITY_MPS2, 9);
    expect(k.maxRangeM).toBeLessThan(k.vacuumAtUpperSpeedM);
    expect(k.cautions.join(' ')).toMatch(/not a substitute for range-safety rules, local codes or licensed practice/);
    expect(k.cautions.join(' ')).toMatch(/Pressure vessels must be rated and inspected/);
  });

  it('grows when the drag coefficient interval widens', async () => {
    // Version 3 pools two shots that disagree (true Cd 0.72 and 0.92): a similar
    // mean, but the Birge ratio widens its interval, so Cd − 2σ is lower.
    const pub = await engineer.post(url(`/presets/${presetId}/versions`)).send({ fitIds: discordant, note: 'two shots that disagree' });
    expect(pub.status, JSON.stringify(pub.body)).toBe(201);
    const v3 = pub.body as PresetVersion;
    const v2 = (await viewer.get(url(`/presets/${presetId}/versions/2`))).body as PresetVersion;
    expect(v3.heterogeneity?.dragCoefficient?.disagree).toBe(true);
    expect(v3.heterogeneity?.dragCoefficient?.verdict).toMatch(/disagree more than their intervals allow/);
    expect(v3.dragCoefficientStd).toBeGreaterThan(3 * v2.dragCoefficientStd);
    const k2 = (await viewer.get(url(`/presets/${presetId}/keep-out?version=2`))).body as KeepOutResponse;
    const k3 = (await viewer.get(url(`/presets/${presetId}/keep-out?version=3`))).body as KeepOutResponse;
    expect(k3.dragCoefficientLower).toBeLessThan(k2.dragCoefficientLower);
    // The speed bound barely moves (same launcher, same true efficiency), so the growth comes from the drag bound.
    expect(Math.abs(k3.speedUpperMps / k2.speedUpperMps - 1)).toBeLessThan(0.05);
    expect(k3.keepOutM).toBeGreaterThan(k2.keepOutM);
  });

  it('says why when the launcher has no maximum working pressure (422)', async () => {
    await t.deps.db.update(launchers).set({ maxWorkingPressurePa: null }).where(and(eq(launchers.id, launcherId), eq(launchers.teamId, teamId)));
    try {
      const res = await viewer.get(url(`/presets/${presetId}/keep-out`));
      expectProblem(res, 422);
      expect(res.body.detail).toMatch(/maximum working pressure/);
    } finally {
      await t.deps.db.update(launchers).set({ maxWorkingPressurePa: 1.0e6 }).where(eq(launchers.id, launcherId));
    }
  });
});

describe('measured against forecast', () => {
  it('puts each approved shot’s measured speed and tape range beside the forecast at its own pressure', async () => {
    const res = await viewer.get(url(`/presets/${presetId}/measured-vs-forecast?version=2`));
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(2);
    const rows = res.body.rows as { fitId: string; measuredSpeedMps: number; forecastSpeedMps: number; tapeRangeM: number; forecastRangeM: number; chamberPressurePa: number }[];
    expect(rows.map((r) => r.fitId).sort()).toEqual([...agreeing, ...discordant].sort());
    const v2 = (await viewer.get(url(`/presets/${presetId}/versions/2`))).body as PresetVersion;
    for (const r of rows) {
      const model = adiabaticSpeed({ gaugePressurePa: r.chamberPressurePa, boreDiameterM: 0.04, barrelLengthM: 0.6, massKg: 0.055, chamberVolumeM3: 0.0015, atmosphericPressurePa: DAY.stationPressurePa }).speedMps;
      expect(r.forecastSpeedMps).toBeCloseTo(model * Math.sqrt(v2.efficiency), 9);
      // The pooled preset should forecast its own shots' speeds to a few per cent.
      expect(Math.abs(r.measuredSpeedMps / r.forecastSpeedMps - 1)).toBeLessThan(0.05);
      expect(r.tapeRangeM).toBeGreaterThan(0);
      expect(r.forecastRangeM).toBeGreaterThan(0);
    }
  });
});

describe('fits remember the version they were compared against', () => {
  it('records a comparison (engineers only) and lists it on the fit', async () => {
    expectProblem(await analyst.post(url(`/presets/${presetId}/versions/2/comparisons`)).send({ fitIds: [discordant[0]] }), 403);
    const res = await engineer.post(url(`/presets/${presetId}/versions/2/comparisons`)).send({ fitIds: [discordant[0]] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const list = await viewer.get(url(`/fits/${discordant[0]}/preset-comparisons`));
    expect(list.body).toEqual(expect.arrayContaining([expect.objectContaining({ presetId, version: 2, role: 'compared' }), expect.objectContaining({ presetId, version: 3, role: 'pooled' })]));
  });
});

describe('simulated fits', () => {
  it('read like any stored fit on the fits API', async () => {
    const res = await viewer.get(`/api/teams/${teamId}/fits/${agreeing[0]}`);
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
  });
});

describe('demo presets', () => {
  it('the demo team has at least two presets with history', async () => {
    const res = await viewer.get(url('/presets'));
    expect(res.status).toBe(200);
    const names = (res.body as { name: string; versionCount: number }[]).filter((p) => Object.values(DEMO_PRESET_NAMES).includes(p.name as never));
    expect(names).toHaveLength(2);
    for (const p of names) expect(p.versionCount).toBeGreaterThanOrEqual(2);
  });
});
