// From an uploaded clip to the launch speed and drag coefficient, through the
// real API: real ffmpeg renders and extracts the clip, the real worker runs,
// PostgreSQL stores every step. The reference is the clip generator's truth
// file (the trajectory it rendered, integrated independently of the fit with
// tight tolerances), not anything the fit itself computed.
import { spawnSync } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fits } from '../../server/db/schema/fits';
import { canonicalJson } from '../../server/fits/input-hash';
import { jsonDifferences } from '../../server/fits/run-fit';
import { teams } from '../../server/db/schema/teams';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { fitShot } from '../../shared/physics/fit-shot';
import type { FitDetail } from '../../shared/schemas/fits';
import { generateFitClip, markedShot, type MarkedShot } from '../support/fit-scenario';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';
import type { GeneratedClip } from '../../server/fixtures/clip-generator';

let t: TestApp;
let analyst: request.Agent;
let teamId: string;
let clip: GeneratedClip;
let cleanupClip: () => Promise<void>;
let shot: MarkedShot;
let fit: FitDetail;
const root = path.resolve(import.meta.dirname, '../..');

beforeAll(async () => {
  t = await createTestApp({ jobSchema: `jobs_fit_${uniqueSuffix()}` }, {}, { jobs: 'worker' });
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  [{ id: teamId }] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  ({ clip, cleanup: cleanupClip } = await generateFitClip());
  shot = await markedShot(analyst, teamId, clip, 5);
  const res = await analyst.post(`/api/teams/${teamId}/tracks/${shot.trackId}/fits`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  fit = res.body;
}, 300_000);

afterAll(async () => {
  await cleanupClip?.();
  await t?.close();
});

describe('upload to number', () => {
  it('uses the calibration, conditions and marks it was given', () => {
    expect(fit.snapshot.marks).toHaveLength(clip.truth.frameCount);
    // The truth scale bar is 120 px for 2 m: 60 px/m.
    expect(fit.snapshot.calibration.pixelsPerMetre).toBeCloseTo(clip.truth.pixelsPerMetre, 9);
    // Dry air at 20 °C and the pressure chosen for 1.2 kg/m³ (ideal gas law, p = rho R T / M).
    expect(fit.snapshot.air.densityKgM3).toBeCloseTo(clip.truth.airDensityKgM3, 9);
    // Frame times are i / 240 s from the extracted frame table.
    expect(fit.snapshot.marks[10].tS).toBeCloseTo(10 / 240, 9);
    expect(fit.state).toBe('awaiting-review');
  });

  it('launch speed within 1 % and Cd within 5 % of the truth', () => {
    const r = fit.result;
    expect(Math.abs(r.launchSpeedMps.value / clip.truth.launchSpeedMps - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.dragCoefficient.value / clip.truth.dragCoefficient - 1)).toBeLessThan(0.05);
    // The launch angle is measured from a level line that is truly level in the rendered scene.
    expect(Math.abs(r.launchAngleDeg.value - clip.truth.launchAngleDeg)).toBeLessThan(0.5);
    expect(r.dragResolved).toBe(true);
    // An honest interval holds the truth (95 %: for this fixed seed it does; a failure means a broken interval or a biased fit).
    expect(r.launchSpeedMps.ci95[0]).toBeLessThan(clip.truth.launchSpeedMps);
    expect(r.launchSpeedMps.ci95[1]).toBeGreaterThan(clip.truth.launchSpeedMps);
    expect(r.dragCoefficient.ci95[0]).toBeLessThan(clip.truth.dragCoefficient);
    expect(r.dragCoefficient.ci95[1]).toBeGreaterThan(clip.truth.dragCoefficient);
  });

  it('stores the headline numbers beside the result for listing', async () => {
    const [row] = await t.deps.db.select().from(fits).where(eq(fits.id, fit.id));
    expect(row.launchSpeedMps).toBe(fit.result.launchSpeedMps.value);
    expect(row.dragCoefficient).toBe(fit.result.dragCoefficient.value);
    expect(row.inputHash).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('reproduction from the snapshot', () => {
  it('the stored fit reproduces bit for bit on the server', async () => {
    const res = await analyst.post(`/api/teams/${teamId}/fits/${fit.id}/reproduce`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ identical: true, inputHashMatches: true, differences: [] });
  });

  it('fitShot on the stored input gives the stored numbers exactly', async () => {
    const [row] = await t.deps.db.select({ input: fits.inputSnapshot, result: fits.result }).from(fits).where(eq(fits.id, fit.id));
    const again = JSON.parse(JSON.stringify(fitShot(row.input.fitInput)));
    // Every leaf compared with Object.is, so one last-bit difference anywhere fails.
    expect(jsonDifferences(again, row.result)).toEqual([]);
    // And as text with sorted keys (jsonb keeps its own key order): exact for doubles, which print in shortest round-trip form.
    expect(canonicalJson(again)).toBe(canonicalJson(row.result));
    expect(Object.is(again.launchSpeedMps.value, row.result.launchSpeedMps.value)).toBe(true);
    expect(Object.is(again.dragCoefficient.value, row.result.dragCoefficient.value)).toBe(true);
  });
});

describe('the API and `npm run fit` agree', () => {
  it('gives identical numbers for identical marks', async () => {
    const input = fit.snapshot.fitInput;
    const dir = await mkdtemp(path.join(os.tmpdir(), 'arcbench-fit-cli-'));
    try {
      const csv = ['t_s,x_m,y_m', ...input.marks.map((m) => `${m.tS},${m.xM},${m.yM}`)].join('\n');
      const file = path.join(dir, 'marks.csv');
      await writeFile(file, `${csv}\n`);
      const cli = spawnSync(
        path.join(root, 'node_modules/.bin/tsx'),
        ['server/cli/fit.ts', file, '--mass-kg', String(input.massKg), '--diameter-m', String(input.diameterM), '--air-density-kgm3', String(input.airDensityKgM3)],
        { cwd: root, encoding: 'utf8' },
      );
      expect(cli.status, cli.stderr).toBe(0);
      const out = JSON.parse(cli.stdout);
      const r = fit.result;
      // The fitted values depend only on marks, mass, diameter and air density: bit-identical.
      expect(out.model).toBe(r.model);
      expect(out.launchSpeedMps.value).toBe(r.launchSpeedMps.value);
      expect(out.launchAngleDeg.value).toBe(r.launchAngleDeg.value);
      expect(out.dragCoefficient.value).toBe(r.dragCoefficient.value);
      expect(out.dragK_perM.value).toBe(r.dragK_perM.value);
      expect(out.rmsResidualM).toBe(r.rmsResidualM);
      expect(out.dragVerdict).toBe(r.dragVerdict);
      // Purely statistical intervals match too; speed, angle and Cd intervals differ by design,
      // because the API adds the scale, mass, diameter, air-density and level uncertainties the CLI is not told.
      expect(out.launchAngleDeg.value).toBe(r.launchAngleDeg.value);
      expect(r.launchAngleDeg.ci95[1] - r.launchAngleDeg.ci95[0]).toBeGreaterThan(out.launchAngleDeg.ci95[1] - out.launchAngleDeg.ci95[0]);
      expect(out.x0M).toEqual(r.x0M);
      expect(out.y0M).toEqual(r.y0M);
      expect(r.dragCoefficient.ci95[1] - r.dragCoefficient.ci95[0]).toBeGreaterThan(out.dragCoefficient.ci95[1] - out.dragCoefficient.ci95[0]);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
