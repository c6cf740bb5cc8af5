// Exports of a stored fit: the PDF report opens in an independent PDF reader
// (pdf-parse, on Mozilla's pdf.js) and its text carries the fitted values, the
// inputs and the safety caution; the CSV's residuals agree with the physics
// core's own; the JSON is the whole fit.
import { eq } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teams } from '../../server/db/schema/teams';
import type { GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { formatInterval, formatValue } from '../../shared/fits/format';
import type { FitDetail } from '../../shared/schemas/fits';
import { generateFitClip, markedShot } from '../support/fit-scenario';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let viewer: request.Agent;
let teamId: string;
let clip: GeneratedClip;
let cleanupClip: () => Promise<void>;
let fit: FitDetail;

beforeAll(async () => {
  t = await createTestApp({ jobSchema: `jobs_report_${uniqueSuffix()}` }, {}, { jobs: 'worker' });
  const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  [{ id: teamId }] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  ({ clip, cleanup: cleanupClip } = await generateFitClip());
  const shot = await markedShot(analyst, teamId, clip, 13);
  const res = await analyst.post(`/api/teams/${teamId}/tracks/${shot.trackId}/fits`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  fit = res.body;
}, 300_000);

afterAll(async () => {
  await cleanupClip?.();
  await t?.close();
});

/** Supertest hands binary bodies over as Buffers only with a parser. */
function binary(res: request.Response, callback: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
}

describe('PDF report', () => {
  let text: string;
  let pages: number;

  beforeAll(async () => {
    const res = await viewer.get(`/api/teams/${teamId}/fits/${fit.id}/report.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/pdf/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?fit-report-[0-9a-f-]+\.pdf"?$/);
    const pdf = res.body as Buffer;
    // ISO 32000-1 §7.5.2: a PDF file starts with the header %PDF-1.n.
    expect(pdf.subarray(0, 8).toString('latin1')).toMatch(/^%PDF-1\.\d/);
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const result = await parser.getText();
    text = result.text.replace(/\s+/g, ' ');
    pages = result.total;
    await parser.destroy();
  });

  it('opens, with the numbers, plots and inputs on their pages', () => {
    expect(pages).toBeGreaterThanOrEqual(2);
    expect(text).toContain(`Fit report: ${fit.shot.label}`);
  });

  it('contains the fitted values and their intervals', () => {
    const r = fit.result;
    for (const e of [r.launchSpeedMps, r.launchAngleDeg, r.dragCoefficient, r.dragK_perM]) {
      expect(text).toContain(formatValue(e));
      expect(text).toContain(formatInterval(e));
    }
    // The numbers themselves are close to the clip's truth, so the report is not printing something else.
    expect(Number(formatValue(r.launchSpeedMps))).toBeCloseTo(clip.truth.launchSpeedMps, 0);
    expect(text).toContain(r.dragVerdict);
    for (const source of ['marking scatter', 'scale', 'mass', 'diameter', 'air density']) expect(text).toContain(source);
  });

  it('states the inputs and the safety caution', () => {
    expect(text).toContain(fit.inputHash);
    expect(text).toContain(`${fit.snapshot.calibration.pixelsPerMetre.toFixed(3)} px/m`);
    expect(text).toContain('Launchers and pressure vessels can injure. Follow local codes, range-safety rules and licensed practice.');
    expect(text).toContain('Trajectory');
    expect(text).toContain('Residuals against time');
    expect(text).toContain('Speed against time');
  });
});

describe('CSV and JSON exports', () => {
  it('CSV: one row per mark, residuals as the physics core computed them', async () => {
    const res = await viewer.get(`/api/teams/${teamId}/fits/${fit.id}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const [header, ...rows] = res.text.trim().split('\n');
    expect(header).toBe('frame,t_s,u_px,v_px,x_m,y_m,fit_x_m,fit_y_m,residual_x_m,residual_y_m,outlier');
    expect(rows).toHaveLength(clip.truth.frameCount);
    rows.forEach((line, i) => {
      const [frame, tS, , , x, y, fx, fy, rx, ry] = line.split(',').map(Number);
      expect(frame).toBe(fit.snapshot.marks[i].frameNumber);
      expect(rx).toBeCloseTo(x - fx, 12);
      expect(ry).toBeCloseTo(y - fy, 12);
      // The CSV re-integrates the fitted path; the fit's own residuals agree to the integrator tolerance (1e-10).
      const own = fit.result.residuals[i];
      expect(own.tS).toBe(tS);
      expect(Math.abs(rx - own.xResidualM)).toBeLessThan(1e-7);
      expect(Math.abs(ry - own.yResidualM)).toBeLessThan(1e-7);
    });
  });

  it('JSON: the whole fit with its snapshot', async () => {
    const res = await viewer.get(`/api/teams/${teamId}/fits/${fit.id}/export.json`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const body = JSON.parse((res.body as Buffer).toString('utf8'));
    expect(body.id).toBe(fit.id);
    expect(body.result.launchSpeedMps).toEqual(fit.result.launchSpeedMps);
    expect(body.snapshot.fitInput.marks).toHaveLength(clip.truth.frameCount);
  });

  it('an unknown fit is a 404 problem, not an empty file', async () => {
    expectProblem(await viewer.get(`/api/teams/${teamId}/fits/00000000-0000-4000-8000-000000000000/report.pdf`), 404);
  });
});
