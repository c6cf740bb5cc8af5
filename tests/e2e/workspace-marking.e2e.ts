// The calibrate-and-mark workspace end to end, in Debian's chromium against
// the real server, database and ffmpeg: an analyst sets the scale and the
// origin on a generated clip, a tracker places ten marks by clicking, and
// after a reload every mark is in the ledger with the right world position.
//
// Expected world positions are computed here from the clicked pixels with
// shared/geometry (the same transform the server uses), and checked against
// the clip generator's truth (its known scale and launch point) within the
// click's rounding to screen pixels.
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { buildCalibrationTransform } from '../../shared/geometry/calibration-transform';
import type { PixelPoint } from '../../shared/geometry/points';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import path from 'node:path';
import { ARTIFACTS_DIR, launchBrowser, screenshot, signIn } from '../support/browser';
import { demoTeamId, jsonOf as json, uploadGeneratedClip } from '../support/generated-clip-upload';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function signedInContext(email: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), email, DEMO_PASSWORD);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  return { context, page };
}

interface StageGeometry {
  left: number;
  top: number;
  zoom: number;
  panX: number;
  panY: number;
}

async function stageGeometry(page: Page): Promise<StageGeometry> {
  return page.evaluate(() => {
    const stage = document.querySelector<HTMLElement>('[data-testid="frame-stage"]')!;
    const content = stage.querySelector<HTMLElement>('.konvajs-content')!.getBoundingClientRect();
    return { left: content.left, top: content.top, zoom: Number(stage.dataset.zoom), panX: Number(stage.dataset.panX), panY: Number(stage.dataset.panY) };
  });
}

/**
 * Clicks as near as the screen allows to a frame pixel and returns the frame
 * pixel actually clicked (mouse positions are whole CSS pixels).
 */
async function clickFramePixel(page: Page, p: PixelPoint): Promise<PixelPoint> {
  // The ledger sits below the fold: after a click on one of its frame buttons the
  // page has scrolled and the frame is off screen, where a mouse click lands nowhere.
  await page.getByTestId('frame-stage').scrollIntoViewIfNeeded();
  const g = await stageGeometry(page);
  const x = Math.round(g.left + g.panX + p.u * g.zoom);
  const y = Math.round(g.top + g.panY + p.v * g.zoom);
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.mouse.up();
  return { u: (x - g.left - g.panX) / g.zoom, v: (y - g.top - g.panY) / g.zoom };
}

async function waitForShownFrame(page: Page, frameNumber: number) {
  await page.waitForFunction(
    (n) => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame === String(n),
    frameNumber,
  );
}

it('an analyst calibrates, a tracker marks ten frames, and after a reload the ledger holds them in metres', async () => {
  const baseUrl = inject('baseUrl');
  const analyst = await signedInContext(demoPerson('analyst').email);
  const teamId = await demoTeamId(analyst.page.request, baseUrl);
  const { clipId, truth } = await uploadGeneratedClip(analyst.page.request, baseUrl, teamId, 'clean', { frameCount: 30, seed: 29 });
  const workspaceUrl = `${baseUrl}/t/${teamId}/clips/${clipId}/workspace`;

  // ---- analyst: scale reference by its two ends and its length, then the origin
  const a = analyst.page;
  await a.goto(workspaceUrl);
  await waitForShownFrame(a, 0);
  await a.getByRole('button', { name: /^Ruler/ }).click();
  const p1 = await clickFramePixel(a, truth.scaleReference.p1);
  const p2 = await clickFramePixel(a, truth.scaleReference.p2);
  const lengthDialog = a.getByRole('dialog', { name: 'Length of the scale reference' });
  await lengthDialog.getByLabel('Length').fill(String(truth.scaleReference.lengthM));
  await lengthDialog.getByLabel('Tolerance (±)').fill('1');
  await lengthDialog.getByRole('button', { name: 'Use this length' }).click();
  // The loupe follows the cursor over the frame.
  await a.mouse.move(Math.round((await stageGeometry(a)).left + 300), Math.round((await stageGeometry(a)).top + 200));
  await a.waitForFunction(() => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.loupe === 'on');
  const stageBox = (await a.getByTestId('frame-stage').boundingBox())!;
  await a.screenshot({ path: path.join(ARTIFACTS_DIR, 'workspace-loupe.png'), clip: stageBox });
  await a.getByRole('button', { name: /^Origin pin/ }).click();
  const origin = await clickFramePixel(a, truth.originPx);
  await a.getByRole('button', { name: 'Save as version 1' }).click();
  await a.getByText('Saved version 1').waitFor();
  await screenshot(a, 'workspace-calibrated');
  await analyst.context.close();

  // The transform the ledger must agree with, from the pixels actually clicked.
  const transform = buildCalibrationTransform({
    scale: { p1, p2, lengthM: truth.scaleReference.lengthM, lengthTolM: 0.001, endpointSigmaPx: 0.5 },
    origin,
    level: { kind: 'angle', rollDeg: 0 },
    downrange: 'right',
    plane: null,
  });

  // ---- tracker: ten clicks on ten successive frames (Place moves on by itself)
  const tracker = await signedInContext(demoPerson('tracker').email);
  const t = tracker.page;
  await t.goto(workspaceUrl);
  await waitForShownFrame(t, 0);
  // Compare against exactly what was clicked, so the snap stays off here (its accuracy is tested on its own).
  await t.getByLabel(/Snap to centre/).uncheck();
  const clicked: { frameNumber: number; p: PixelPoint }[] = [];
  for (const f of truth.frames.slice(0, 10)) {
    await waitForShownFrame(t, f.frameNumber);
    clicked.push({ frameNumber: f.frameNumber, p: await clickFramePixel(t, { u: f.uPx, v: f.vPx }) });
  }
  await t.getByTestId('save-status').getByText('All marks saved.').waitFor();
  await screenshot(t, 'workspace-marked');

  await t.reload();
  await waitForShownFrame(t, 0);
  const ledger = t.getByRole('table', { name: 'Marks ledger' });
  await ledger.locator('tbody tr').nth(9).waitFor();
  const rows = await ledger.locator('tbody tr').evaluateAll((trs) =>
    trs.map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.trim().replace('\u2212', '-'))),
  );
  expect(rows).toHaveLength(10);

  for (const [i, c] of clicked.entries()) {
    const [frame, , u, v, x, y, how] = rows[i];
    expect(Number(frame)).toBe(c.frameNumber);
    expect(Number(u)).toBeCloseTo(c.p.u, 2);
    expect(Number(v)).toBeCloseTo(c.p.v, 2);
    const w = transform.imageToWorld(c.p);
    // The ledger prints metres to 4 decimals.
    expect(Math.abs(Number(x) - w.x)).toBeLessThanOrEqual(0.00005 + 1e-9);
    expect(Math.abs(Number(y) - w.y)).toBeLessThanOrEqual(0.00005 + 1e-9);
    expect(how).toBe('placed');

    // Against the generator's truth: world = (pixel - launch point) / (its pixels per metre), y up.
    // Clicks land within half a screen pixel of the truth pixel; allow one screen pixel plus the scale clicks' share.
    const truthFrame = truth.frames[i];
    const xTruth = (truthFrame.uPx - truth.originPx.u) / truth.pixelsPerMetre;
    const yTruth = (truth.originPx.v - truthFrame.vPx) / truth.pixelsPerMetre;
    expect(Math.abs(Number(x) - xTruth)).toBeLessThan(0.02);
    expect(Math.abs(Number(y) - yTruth)).toBeLessThan(0.02);
  }

  // The server computes the same world coordinates from the saved calibration.
  const tracks = await json<{ tracks: { id: string; markCount: number }[] }>(await t.request.get(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/tracks`));
  expect(tracks.tracks.map((tr) => tr.markCount)).toEqual([10]);
  const stored = await json<{ marks: { frameNumber: number; xM: number; yM: number }[] }>(
    await t.request.get(`${baseUrl}/api/teams/${teamId}/tracks/${tracks.tracks[0].id}/marks`),
  );
  for (const [i, m] of stored.marks.entries()) {
    const w = transform.imageToWorld(clicked[i].p);
    expect(m.xM).toBeCloseTo(w.x, 6);
    expect(m.yM).toBeCloseTo(w.y, 6);
  }
  await screenshot(t, 'workspace-after-reload');

  // ---- two people on one frame: the analyst moves frame 3's mark while the
  // tracker's page still holds the old one; the tracker's later click gets a
  // conflict, is told who changed it, and can insist on theirs.
  const analystAgain = await signedInContext(demoPerson('analyst').email);
  const b = analystAgain.page;
  await b.goto(workspaceUrl);
  await waitForShownFrame(b, 0);
  await b.getByLabel(/Snap to centre/).uncheck();
  await b.getByRole('table', { name: 'Marks ledger' }).getByRole('button', { name: '3', exact: true }).click();
  await waitForShownFrame(b, 3);
  // The status may still read "All marks saved." before the click's save starts: wait for the save itself,
  // so the analyst's change is stored before the tracker writes over the old revision.
  const analystSave = b.waitForResponse((r) => r.request().method() === 'PUT' && new URL(r.url()).pathname.endsWith('/marks/3'));
  const analystClick = await clickFramePixel(b, { u: truth.frames[3].uPx + 12, v: truth.frames[3].vPx + 12 });
  expect((await analystSave).status()).toBe(200);
  await b.getByTestId('save-status').getByText('All marks saved.').waitFor();

  await ledger.getByRole('button', { name: '3', exact: true }).click();
  await waitForShownFrame(t, 3);
  const trackerClick = await clickFramePixel(t, { u: truth.frames[3].uPx - 12, v: truth.frames[3].vPx - 12 });
  const conflict = t.getByRole('alert').filter({ hasText: 'Frame 3: changed by Tomas Reyes' });
  await conflict.waitFor();
  await screenshot(t, 'workspace-conflict');
  await conflict.getByRole('button', { name: 'Use mine' }).click();
  await t.getByTestId('save-status').getByText('All marks saved.').waitFor();

  const afterConflict = await json<{ marks: { frameNumber: number; uPx: number; vPx: number; updatedBy: { displayName: string } | null }[] }>(
    await t.request.get(`${baseUrl}/api/teams/${teamId}/tracks/${tracks.tracks[0].id}/marks`),
  );
  const frame3 = afterConflict.marks.find((m) => m.frameNumber === 3)!;
  expect(frame3.uPx).toBeCloseTo(trackerClick.u, 6);
  expect(frame3.vPx).toBeCloseTo(trackerClick.v, 6);
  expect(frame3.updatedBy?.displayName).toBe('Ines Varga');
  expect(Math.hypot(frame3.uPx - analystClick.u, frame3.vPx - analystClick.v)).toBeGreaterThan(10);
  expect(afterConflict.marks).toHaveLength(10);

  // ---- snap in the browser: clicks a pixel or so off the projectile on frames 10-14 come back on
  // the generator's true centre. 0.3 px median is the acceptance figure for a clean clip (issue 5).
  await b.getByLabel(/Snap to centre/).check();
  await b.getByTestId('frame-stage').focus();
  await b.keyboard.press('End'); // the track's last marked frame, 9
  await waitForShownFrame(b, 9).catch(async (err) => {
    await screenshot(b, 'workspace-snap-failed');
    throw err;
  });
  await b.keyboard.press('ArrowRight');
  const offsets = [{ du: 1.4, dv: -0.9 }, { du: -1.2, dv: 1.1 }, { du: 0.8, dv: 1.5 }, { du: -1.5, dv: -0.6 }, { du: 1.1, dv: 0.7 }];
  for (const [k, o] of offsets.entries()) {
    const f = truth.frames[10 + k];
    await waitForShownFrame(b, f.frameNumber);
    await clickFramePixel(b, { u: f.uPx + o.du, v: f.vPx + o.dv });
  }
  await b.getByTestId('save-status').getByText('All marks saved.').waitFor();
  const snappedRows = await b.getByRole('table', { name: 'Marks ledger' }).locator('tbody tr').evaluateAll((trs) =>
    trs.map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.trim())),
  );
  const errors = truth.frames.slice(10, 15).map((f) => {
    const row = snappedRows.find((r) => Number(r[0]) === f.frameNumber)!;
    expect(row[6]).toBe('snapped');
    return Math.hypot(Number(row[2]) - f.uPx, Number(row[3]) - f.vPx);
  });
  const sortedErrors = [...errors].sort((x, y) => x - y);
  expect(sortedErrors[2]).toBeLessThan(0.3);
  expect(Math.max(...errors)).toBeLessThan(0.6);
  await analystAgain.context.close();
  await tracker.context.close();

  // ---- a viewer reads everything and changes nothing: tools are disabled, with a note saying why.
  const viewer = await signedInContext(demoPerson('viewer').email);
  const v = viewer.page;
  await v.goto(workspaceUrl);
  await waitForShownFrame(v, 0);
  expect(await v.getByRole('button', { name: /^Place/ }).isDisabled()).toBe(true);
  expect(await v.getByRole('button', { name: /^Ruler/ }).isDisabled()).toBe(true);
  await v.getByText(/Read-only: your role can look at frames and marks/).waitFor();
  await clickFramePixel(v, { u: truth.frames[0].uPx + 30, v: truth.frames[0].vPx - 30 });
  await v.getByRole('table', { name: 'Marks ledger' }).locator('tbody tr').nth(14).waitFor();
  expect(await v.getByRole('table', { name: 'Marks ledger' }).locator('tbody tr').count()).toBe(15);
  expect(await v.getByTestId('save-status').textContent()).toBe('All marks saved.');
  await viewer.context.close();
  // Four people's sessions, an upload and its frame extraction: more than the default two minutes on a busy machine.
}, 300_000);
