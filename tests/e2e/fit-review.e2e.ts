// The engineer's sign-off in a real browser (Debian chromium): Tomas Reyes runs
// the fit of a marked demo shot, Dev Okafor finds it among the fits awaiting
// review, sees its plots drawn and approves it; Tomas then finds the
// notification in his mail. The team keeps separation of duties on, so the fit
// Dev approves is one somebody else ran (his own would not be approvable).
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { FitSummary, ShotFits, ShotOverviewPage } from '../../shared/schemas/fits';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { demoTeamId, jsonOf as json } from '../support/generated-clip-upload';

const HEADERS = { 'X-Arcbench-Request': '1' };
/** The demo shot the seed marked but did not fit (server/seed/demo-fits.ts). */
const SHOT_LABEL = 'H-03';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function signedIn(email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}/);
  return page;
}

it('the engineer approves a fit the analyst ran, and the analyst is told', async () => {
  const baseUrl = inject('baseUrl');
  const tomas = await signedIn(demoPerson('analyst').email);
  // The demo team by name: a sign-in lands on the first team by name, and other browser tests add teams.
  const teamId = await demoTeamId(tomas.request, baseUrl);

  // ---- the analyst runs the fit of the marked demo shot
  const overview = await json<ShotOverviewPage>(await tomas.request.get(`${baseUrl}/api/teams/${teamId}/shot-overview?q=${SHOT_LABEL}`));
  const shot = overview.items.find((r) => r.label === SHOT_LABEL);
  if (!shot) throw new Error(`no demo shot ${SHOT_LABEL} in ${JSON.stringify(overview.items.map((r) => r.label))}`);
  const shotFits = await json<ShotFits>(await tomas.request.get(`${baseUrl}/api/teams/${teamId}/shots/${shot.shotId}/fits`));
  const track = shotFits.tracks.find((t) => t.kind === 'projectile' && t.markCount >= 5)!;
  const ran = await json<FitSummary>(await tomas.request.post(`${baseUrl}/api/teams/${teamId}/tracks/${track.id}/fits`, { headers: HEADERS }));
  expect(ran.state).toBe('awaiting-review');
  expect(ran.createdBy?.displayName).toBe('Tomas Reyes');
  const shotLabel = SHOT_LABEL;

  // ---- the engineer finds it in the shot overview, filtered on the server to fits awaiting review
  const dev = await signedIn(demoPerson('engineer').email);
  await dev.goto(`${baseUrl}/t/${teamId}/results`);
  await dev.getByLabel('Status').selectOption('awaiting-review');
  const row = dev.getByRole('row').filter({ has: dev.getByRole('link', { name: shotLabel, exact: true }) });
  await row.getByText('Awaiting review').waitFor();
  await row.getByText('Awaiting review').click();
  await dev.waitForURL(new RegExp(`/fits/${ran.id}$`));

  // The numbers, the safety note and the plots (recharts draws SVG paths).
  await dev.getByRole('heading', { level: 1, name: `Fit of ${shotLabel}` }).waitFor();
  await dev.getByRole('table', { name: 'Fitted values with 95 % intervals' }).waitFor();
  await dev.getByRole('complementary', { name: 'Safety' }).waitFor();
  for (const chart of ['trajectory', 'speed']) {
    const curve = dev.locator(`[data-chart="${chart}"] .recharts-line path.recharts-curve`);
    await curve.first().waitFor();
    expect(await curve.count()).toBe(2); // drag fit and drag-free fit
    const d = await curve.first().getAttribute('d');
    expect(d?.length ?? 0).toBeGreaterThan(50);
  }
  // Drag-free curve dashed, as the look-and-feel rules say.
  expect(await dev.locator('[data-chart="trajectory"] .recharts-line path.recharts-curve').nth(1).getAttribute('stroke-dasharray')).toBe('6 4');
  expect(await dev.locator('[data-chart="trajectory"] .recharts-scatter-symbol').count()).toBeGreaterThan(5);
  expect(await dev.locator('[data-chart="residuals"] .recharts-scatter-symbol').count()).toBeGreaterThan(5);
  await screenshot(dev, 'fit-review-before');
  await dev.locator('[data-chart="overlay"] canvas').first().waitFor();

  await dev.getByLabel('Note').fill('Residuals flat, drag resolved. Approved for the preset.');
  await dev.getByRole('button', { name: 'Approve fit' }).click();
  await dev.getByText(/Approved by Dev Okafor/).waitFor();
  await dev.getByRole('list', { name: 'Fit history' }).getByText('approved it').waitFor();
  await screenshot(dev, 'fit-review-approved');

  await tomas.goto(`${baseUrl}/mail`);
  await tomas.getByText(`Fit approved: ${shotLabel}`).first().waitFor();
  await tomas.getByText(`Fit approved: ${shotLabel}`).first().click();
  await tomas.getByText(/Residuals flat, drag resolved/).first().waitFor();
  await screenshot(tomas, 'fit-review-mail');
  // Two people's sessions and a fit on the server: more than the default two minutes on a busy machine.
}, 240_000);
