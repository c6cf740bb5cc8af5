// The PDF fit report's layout, read back as text by an independent PDF reader (pdf-parse,
// on Mozilla's pdf.js) from a demo fit: every page numbered, every table headed by its
// columns, numbers and units as the pages write them, and no half-empty first page.
import type request from 'supertest';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FitDetail, ShotOverviewRow } from '../../shared/schemas/fits';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

let t: TestApp;
let viewer: Awaited<ReturnType<typeof signInAs>>;
let teamId: string;
let fit: FitDetail;
let pages: string[];
let text: string;
const url = (path: string) => `/api/teams/${teamId}${path}`;

function binary(res: request.Response, callback: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
}

beforeAll(async () => {
  t = await createTestApp();
  viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  const me = await viewer.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;
  // A fit the demo seed ran on one of its marked clips.
  const overview = await viewer.get(url('/shot-overview')).query({ pageSize: 100 });
  const row = (overview.body.items as ShotOverviewRow[]).find((r) => r.fitId !== null)!;
  expect(row, 'the demo seed runs fits').toBeTruthy();
  fit = (await viewer.get(url(`/fits/${row.fitId}`))).body as FitDetail;
  const res = await viewer.get(url(`/fits/${fit.id}/report.pdf`)).set('Accept-Language', 'en-GB').buffer(true).parse(binary);
  expect(res.status).toBe(200);
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  const result = await parser.getText();
  await parser.destroy();
  pages = result.pages.map((p: { text: string }) => p.text.replace(/\s+/g, ' '));
  text = result.text.replace(/\s+/g, ' ');
});
afterAll(() => t.close());

describe('PDF report layout', () => {
  it('numbers every page', () => {
    expect(pages.length).toBeGreaterThanOrEqual(2);
    pages.forEach((page, i) => expect(page).toContain(`Page ${i + 1} of ${pages.length}`));
  });

  it('heads every table with its columns, again on each page a table runs onto', () => {
    expect(text).toContain('Quantity Value 95 % interval Std. uncertainty');
    expect(text).toContain('Source Launch speed (m/s) Drag coefficient');
    expect(text).toContain('t (s) x (m) y (m) fit x (m) fit y (m) res x (mm) res y (mm)');
    const marksStart = pages.findIndex((p) => p.includes('Marks and residuals'));
    expect(marksStart).toBeGreaterThanOrEqual(0);
    for (const page of pages.slice(marksStart + 1)) expect(page).toContain('t (s) x (m) y (m) fit x (m)');
  });

  it('writes units and numbers as the pages do: kPa, no exponent notation, formatted dates', () => {
    expect(text).toMatch(/\d kPa/);
    expect(text).not.toMatch(/\d Pa\b/);
    expect(text).not.toMatch(/\d\.\d+e[+-]\d/);
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
    // en-GB as the request asked: "2 Dec 2026, 14:05 UTC"-style.
    expect(text).toMatch(/run \d{1,2} [A-Z][a-z]{2} \d{4},? \d{2}:\d{2}/);
  });

  it('fills the first page: the first plot follows the numbers instead of waiting for page 2', () => {
    expect(pages[0]).toContain('Results (95 % intervals)');
    expect(pages[0]).toContain('Trajectory');
  });
});
