// Automatic marking in the browser, end to end against the real server, job
// worker, tracking core and ffmpeg: the tracker opens a clip nobody has
// marked, auto-marks it with one button, steps to a flagged frame in the
// review pass and accepts it; the analyst then runs the fit, whose page says
// how the marks were made. The generated clip's truth is the outside check.
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { AutoMarkSettings } from '../../shared/schemas/auto-mark';
import type { MarksResponse } from '../../shared/schemas/marking';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { FIT_CLIP_OVERRIDES, conditionsForDensity } from '../support/fit-scenario';
import { demoTeamId, jsonOf as json, uploadGeneratedClip } from '../support/generated-clip-upload';

const HEADERS = { 'X-Arcbench-Request': '1' };
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

async function waitForShownFrame(page: Page, frameNumber: number) {
  await page.waitForFunction((n) => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame === String(n), frameNumber);
}

const shownFrame = (page: Page) => page.evaluate(() => Number(document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame));

it('the tracker auto-marks an unmarked clip, reviews a flagged frame, and the fit runs', async () => {
  const baseUrl = inject('baseUrl');
  const analyst = await signedInContext(demoPerson('analyst').email);
  const a = analyst.page;
  const teamId = await demoTeamId(a.request, baseUrl);
  const { clipId, truth } = await uploadGeneratedClip(a.request, baseUrl, teamId, 'clean', { ...FIT_CLIP_OVERRIDES });
  const clip = await json<{ shotId: string }>(await a.request.get(`${baseUrl}/api/teams/${teamId}/clips/${clipId}`));

  // Records and calibration through the API (their screens have browser tests of their own).
  const projectile = await json<{ id: string }>(
    await a.request.post(`${baseUrl}/api/teams/${teamId}/projectiles`, { headers: HEADERS, data: { name: `Foam ball ${Date.now().toString(36)}`, massKg: truth.massKg, diameterM: truth.diameterM } }),
  );
  await json(
    await a.request.patch(`${baseUrl}/api/teams/${teamId}/shots/${clip.shotId}`, {
      headers: HEADERS,
      data: { projectileId: projectile.id, elevationDeg: truth.launchAngleDeg, ...conditionsForDensity(truth.airDensityKgM3) },
    }),
  );
  await json(
    await a.request.post(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/calibrations`, {
      headers: HEADERS,
      data: {
        scale: { p1: truth.scaleReference.p1, p2: truth.scaleReference.p2, lengthM: truth.scaleReference.lengthM, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
        origin: truth.originPx,
        level: { kind: 'line', p1: truth.levelLine.p1, p2: truth.levelLine.p2 },
        downrange: 'right',
      },
    }),
  );
  const settings = await json<AutoMarkSettings>(await a.request.get(`${baseUrl}/api/teams/${teamId}/auto-mark-settings`));

  // ---- tracker: one button
  const tracker = await signedInContext(demoPerson('tracker').email);
  const t = tracker.page;
  const workspaceUrl = `${baseUrl}/t/${teamId}/clips/${clipId}/workspace`;
  await t.goto(workspaceUrl);
  await waitForShownFrame(t, 0);
  const panel = t.getByTestId('auto-mark-panel');
  await panel.getByRole('button', { name: /^Auto-mark track/ }).click();
  await panel.getByTestId('auto-mark-status').getByText('Done').waitFor({ timeout: 120_000 });
  await screenshot(t, 'auto-mark-done');

  const tracks = await json<{ tracks: { id: string; markCount: number }[] }>(await t.request.get(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/tracks`));
  expect(tracks.tracks).toHaveLength(1);
  const trackId = tracks.tracks[0].id;
  const stored = await json<MarksResponse>(await t.request.get(`${baseUrl}/api/teams/${teamId}/tracks/${trackId}/marks`));
  // Marked live into the ledger: every stored mark is a row.
  await t.getByRole('table', { name: 'Marks ledger' }).locator('tbody tr').nth(stored.marks.length - 1).waitFor();
  expect(stored.marks.every((m) => m.source === 'auto')).toBe(true);
  // Against the generator's truth: the automatic marks sit on the projectile (3 px is the issue's bound for any mark).
  for (const m of stored.marks) {
    const f = truth.frames.find((x) => x.frameNumber === m.frameNumber)!;
    expect(Math.hypot(m.uPx - f.uPx, m.vPx - f.vPx)).toBeLessThanOrEqual(3);
  }

  // A flagged frame to review: the marker's own flags when it has any; else the team raises its threshold just above the least sure mark.
  let threshold = settings.reviewThreshold;
  const flagged = () => stored.marks.filter((m) => m.confidence! < threshold);
  if (flagged().length === 0) {
    threshold = Math.min(1, Math.min(...stored.marks.map((m) => m.confidence!)) + 1e-3);
    await json(await a.request.put(`${baseUrl}/api/teams/${teamId}/auto-mark-settings`, { headers: HEADERS, data: { reviewThreshold: threshold } }));
    await t.reload();
    await waitForShownFrame(t, 0);
  }
  try {
    const toCheck = flagged().map((m) => m.frameNumber).sort((x, y) => x - y);
    expect(toCheck.length).toBeGreaterThan(0);
    await panel.getByRole('button', { name: /^Review/ }).click();
    const review = t.getByRole('region', { name: 'Review pass' });
    await review.getByText(`Frame ${toCheck[0]}, 1 of ${toCheck.length} to check`).waitFor();
    expect(await shownFrame(t)).toBe(toCheck[0]);
    await screenshot(t, 'auto-mark-review');
    await review.getByRole('button', { name: /^Accept/ }).click();
    await t.getByTestId('save-status').getByText('All marks saved.').waitFor();
    if (toCheck.length > 1) await waitForShownFrame(t, toCheck[1]);

    const after = await json<MarksResponse>(await t.request.get(`${baseUrl}/api/teams/${teamId}/tracks/${trackId}/marks`));
    const accepted = after.marks.find((m) => m.frameNumber === toCheck[0])!;
    const before = stored.marks.find((m) => m.frameNumber === toCheck[0])!;
    expect(accepted.source).toBe('hand');
    expect(accepted.confidence).toBeNull();
    expect(accepted.uPx).toBeCloseTo(before.uPx, 9);
    expect(accepted.vPx).toBeCloseTo(before.vPx, 9);

    // ---- analyst: the fit runs on the automatic marks, leaving out the flagged ones still unchecked
    await a.goto(`${baseUrl}/t/${teamId}/shots/${clip.shotId}/fits`);
    await a.getByRole('button', { name: 'Run fit' }).click();
    await a.getByRole('heading', { level: 1, name: /^Fit of/ }).waitFor({ timeout: 60_000 });
    const autoCount = after.marks.filter((m) => m.source === 'auto' && m.confidence! >= threshold).length;
    const leftOut = toCheck.length - 1;
    await a.getByText(new RegExp(`^${autoCount} automatic, 1 by hand; ${leftOut === 0 ? 'none left out' : `${leftOut} automatic mark`}`)).waitFor();
    await screenshot(a, 'auto-mark-fit');
  } finally {
    if (threshold !== settings.reviewThreshold) {
      await a.request.put(`${baseUrl}/api/teams/${teamId}/auto-mark-settings`, { headers: HEADERS, data: settings });
    }
  }
  await tracker.context.close();
  await analyst.context.close();
}, 300_000);
