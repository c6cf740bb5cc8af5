// Lens correction in the workspace, in Debian's chromium against the real
// server: on a generated clip seen through a known barrel lens (clip
// generator, camera effects), an analyst clicks three points along each fence
// rail and post with the straight-edge tool, fits the lens, reads the
// coefficients and the straightness residual, switches the corrected grid on,
// and saves; the server fits the same edges again and stores the same lens.
//
// Checks: the fitted k1 against the generator's true k1 (the picture was bent
// by it, shared/geometry/lens-distortion.ts, Brown–Conrady closed form), and
// the shown numbers against the shared plumb-line fit run here on the pixels
// actually clicked.
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { fitPlumbLines } from '../../shared/geometry/plumb-line-fit';
import type { PixelPoint } from '../../shared/geometry/points';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { demoTeamId, jsonOf as json, uploadGeneratedClip } from '../support/generated-clip-upload';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function stageGeometry(page: Page) {
  return page.evaluate(() => {
    const stage = document.querySelector<HTMLElement>('[data-testid="frame-stage"]')!;
    const content = stage.querySelector<HTMLElement>('.konvajs-content')!.getBoundingClientRect();
    return { left: content.left, top: content.top, zoom: Number(stage.dataset.zoom), panX: Number(stage.dataset.panX), panY: Number(stage.dataset.panY) };
  });
}

/** Clicks (or double-clicks) as near as the screen allows to a frame pixel; returns the frame pixel actually clicked. */
async function clickFramePixel(page: Page, p: PixelPoint, { double = false } = {}): Promise<PixelPoint> {
  // The lens panel sits beside and below the frame; after a click there the frame may be scrolled partly out of view.
  await page.getByTestId('frame-stage').scrollIntoViewIfNeeded();
  const g = await stageGeometry(page);
  const x = Math.round(g.left + g.panX + p.u * g.zoom);
  const y = Math.round(g.top + g.panY + p.v * g.zoom);
  if (double) await page.mouse.dblclick(x, y);
  else await page.mouse.click(x, y);
  return { u: (x - g.left - g.panX) / g.zoom, v: (y - g.top - g.panY) / g.zoom };
}

/** The value beside a label in the calibration card, with the typographic minus read as '-'. */
async function cardValue(page: Page, label: string): Promise<string> {
  const card = page.getByRole('region', { name: 'Lens correction' });
  const row = card.locator('dl > div').filter({ has: page.locator('dt', { hasText: label }) });
  return (await row.locator('dd').textContent())!.replace(/\u2212/g, '-');
}

it('an analyst clicks straight edges, fits the lens, sees the residual and the corrected grid, and the server stores the same lens', async () => {
  const baseUrl = inject('baseUrl');
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const page = await context.newPage();
  await signIn(page, baseUrl, demoPerson('analyst').email, DEMO_PASSWORD);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  const teamId = await demoTeamId(page.request, baseUrl);
  const TRUE_K1 = -0.14;
  const { clipId, truth } = await uploadGeneratedClip(page.request, baseUrl, teamId, 'clean', {
    frameCount: 12,
    seed: 37,
    camera: { lens: { k1: TRUE_K1, k2: 0 }, straightEdges: true },
  });
  const edges = truth.camera!.straightEdges;
  expect(edges.length).toBeGreaterThanOrEqual(4);

  await page.goto(`${baseUrl}/t/${teamId}/clips/${clipId}/workspace`);
  await page.waitForFunction(() => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame === '0');
  await page.getByRole('button', { name: /^Straight edge/ }).click();

  // Three points per edge: both ends and the middle, where the bow is largest.
  const threeAlong = (edge: PixelPoint[]) => [edge[0], edge[Math.floor(edge.length / 2)], edge[edge.length - 1]];
  const clicked: PixelPoint[][] = [];
  const clickEdge = async (edge: PixelPoint[], end: 'enter' | 'double-click') => {
    const [a, m, b] = threeAlong(edge);
    const points = [await clickFramePixel(page, a), await clickFramePixel(page, m)];
    if (end === 'enter') {
      points.push(await clickFramePixel(page, b));
      await page.keyboard.press('Enter');
    } else {
      // A double-click puts the last point and ends the edge.
      points.push(await clickFramePixel(page, b, { double: true }));
    }
    clicked.push(points);
  };

  // An edge of two points does not end; the tool says why.
  await clickFramePixel(page, edges[0][0]);
  await clickFramePixel(page, edges[0][edges[0].length - 1]);
  await page.keyboard.press('Enter');
  await page.getByRole('status').filter({ hasText: 'needs at least 3 points' }).waitFor();
  await page.keyboard.press('Escape');

  // One edge determines nothing: the plain message, and no lens.
  await clickEdge(edges[0], 'enter');
  await page.getByRole('button', { name: 'Fit lens to the edge' }).click();
  await page.getByRole('alert').filter({ hasText: 'Click at least 2 straight edges' }).waitFor();

  for (const [i, edge] of edges.slice(1).entries()) await clickEdge(edge, i % 2 ? 'double-click' : 'enter');
  await expect.poll(() => page.getByTestId('straight-edge-count').textContent()).toContain(`${edges.length} straight edges clicked (${3 * edges.length} points)`);
  await page.getByRole('button', { name: `Fit lens to ${edges.length} edges` }).click();
  await page.getByRole('region', { name: 'Lens correction' }).getByText('Straightness residual').waitFor();

  // The shared fit on the same clicks (what the browser ran, and what the server will run).
  const expected = fitPlumbLines(clicked, { widthPx: truth.width, heightPx: truth.height }, { clickSigmaPx: 0.5 });
  const [k1Text, k1SigmaText] = (await cardValue(page, 'k1')).split('±').map((s) => Number(s.trim()));
  expect(k1Text).toBeCloseTo(expected.coefficients.k1, 3);
  expect(k1SigmaText).toBeGreaterThan(0);
  // Clicks are whole screen pixels (about 0.3 frame px here); the bow of a −0.14 lens is tens of pixels, so k1 comes back close.
  expect(Math.abs(k1Text - TRUE_K1)).toBeLessThan(0.02);
  const residual = Number((await cardValue(page, 'Straightness residual')).replace('px RMS', '').trim());
  expect(residual).toBeCloseTo(expected.residualRmsPx, 2);
  expect(residual).toBeLessThan(1.5);

  // The corrected grid: off until switched on, then drawn through the fitted lens.
  const stage = page.getByTestId('frame-stage');
  expect(await stage.getAttribute('data-lens-grid')).toBe('off');
  await page.getByLabel('Show the corrected grid on the frame').check();
  expect(await stage.getAttribute('data-lens-grid')).toBe('on');
  await screenshot(page, 'workspace-lens-grid');
  await page.getByLabel('Show the corrected grid on the frame').uncheck();
  expect(await stage.getAttribute('data-lens-grid')).toBe('off');

  // Save with a scale and an origin: the server fits the same edges again.
  await page.getByRole('button', { name: /^Ruler/ }).click();
  await clickFramePixel(page, truth.scaleReference.p1);
  await clickFramePixel(page, truth.scaleReference.p2);
  const lengthDialog = page.getByRole('dialog', { name: 'Length of the scale reference' });
  await lengthDialog.getByLabel('Length').fill(String(truth.scaleReference.lengthM));
  await lengthDialog.getByRole('button', { name: 'Use this length' }).click();
  await page.getByRole('button', { name: /^Origin pin/ }).click();
  await clickFramePixel(page, truth.originPx);
  await page.getByRole('button', { name: 'Save as version 1' }).click();
  await page.getByText('Saved version 1').waitFor();
  await page.getByText('As saved in version 1.').waitFor();

  const stored = await json<{ calibration: { lens: { source: string; k1: number; residualRmsPx: number; straightLines: PixelPoint[][] } } }>(
    await page.request.get(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/calibrations/current`),
  );
  expect(stored.calibration.lens.source).toBe('straight-lines');
  expect(stored.calibration.lens.straightLines).toHaveLength(edges.length);
  expect(stored.calibration.lens.k1).toBeCloseTo(expected.coefficients.k1, 6);
  expect(stored.calibration.lens.residualRmsPx).toBeCloseTo(expected.residualRmsPx, 4);
  await context.close();
  // An upload with its frame extraction and a client build's worth of clicking: more than the default two minutes on a busy machine.
}, 300_000);
