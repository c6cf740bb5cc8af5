// The engineer folds approved shots into a preset in a real browser (Debian
// chromium): Dev Okafor reads the OL-40 forecast, pools the approved demo fits
// into a new version after seeing the pooled value and the heterogeneity
// words, and the forecast page then shows different numbers from the new version.
import type { Page } from 'playwright-core';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { DEMO_PRESET_NAMES } from '../../server/seed/demo-presets';
import { launchBrowser, screenshot, signIn } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function readForecast(page: Page, url: string) {
  await page.goto(url);
  await page.getByRole('heading', { level: 1, name: 'Forecast' }).waitFor();
  const range = page.getByTestId('forecast-range');
  await range.waitFor();
  // The trajectories are drawn: with drag (teal) and without (violet, dashed).
  const curves = page.locator('[data-chart="forecast-trajectory"] .recharts-line path.recharts-curve');
  await curves.nth(1).waitFor();
  expect(await curves.nth(1).getAttribute('stroke-dasharray')).toBe('6 4');
  await page.getByTestId('keep-out-distance').waitFor();
  return {
    range: (await range.textContent())!.trim(),
    speed: (await page.getByTestId('forecast-muzzle-speed').textContent())!.trim(),
    subtitle: (await page.getByText(/version \d+: Cd/).first().textContent())!.trim(),
  };
}

it('publishing a version from approved demo fits changes the forecast', async () => {
  const context = await browser.newContext({ viewport: { width: 1400, height: 1100 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), demoPerson('engineer').email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}/);
  // Sign-in opens the first of the engineer's teams by name, and other browser tests add
  // the demo people to teams of their own: open the demo team explicitly.
  const me = (await (await page.request.get(`${inject('baseUrl')}/api/auth/me`)).json()) as { teams: { id: string; slug: string }[] };
  const teamId = me.teams.find((team) => team.slug === DEMO_TEAM.slug)!.id;
  await page.goto(`${inject('baseUrl')}/t/${teamId}`);
  await page.getByRole('heading', { level: 1, name: DEMO_TEAM.name, exact: true }).waitFor();

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Presets' }).click();
  await page.getByRole('link', { name: DEMO_PRESET_NAMES.lt40 }).click();
  await page.waitForURL(/\/presets\/[0-9a-f-]{36}$/);
  const presetUrl = page.url();
  const presetId = presetUrl.split('/').at(-1)!;
  // The history the seed left: version 1 from the handbook, version 2 pooled.
  await page.getByTestId('version-1').getByText(/handbook: blunt projectile/).first().waitFor();
  await page.getByTestId('version-2').getByText(/pooled from 3 approved fits/).first().waitFor();
  await page.getByRole('complementary', { name: 'Safety' }).first().getByText(/not a substitute for range-safety rules/).waitFor();

  const before = await readForecast(page, `${inject('baseUrl')}/t/${teamId}/forecast?preset=${presetId}`);
  expect(before.subtitle).toMatch(/version 2:/);
  await screenshot(page, 'presets-forecast-before');

  await page.goto(presetUrl);
  for (const label of ['HF-01', 'HF-02', 'HF-03', 'HF-04', 'HF-05']) await page.getByLabel(`Pool ${label}`).check();
  await page.getByRole('button', { name: /^Pool 5 fits$/ }).click();
  const preview = page.getByTestId('pool-preview');
  await preview.waitFor();
  // The heterogeneity words are shown before anything is published.
  await preview.getByText(/The shots (agree within|disagree more than) their intervals/).first().waitFor();
  await page.getByLabel('Note').fill('All five morning shots');
  // The seed fired HF-04 and HF-05 with a newer batch of heads and a tired valve seal
  // (server/seed/demo-presets.ts), so pooling all five disagrees and the preview says so.
  await preview.getByText(/The shots disagree more than their intervals/).first().waitFor();
  await page.getByRole('button', { name: 'Publish version' }).click();
  // Fits that disagree are published only after a confirmation that states the heterogeneity.
  const confirm = page.getByRole('dialog', { name: 'Publish although the fits disagree?' });
  await confirm.getByTestId('publish-heterogeneity').getByText(/I² \d+%/).first().waitFor();
  // Cancelled, nothing is published.
  await confirm.getByRole('button', { name: 'Cancel' }).click();
  await confirm.waitFor({ state: 'hidden' });
  expect(await page.getByTestId('version-3').count()).toBe(0);
  await page.getByRole('button', { name: 'Publish version' }).click();
  await confirm.getByRole('button', { name: 'Publish anyway' }).click();
  await page.getByText('Version 3 published.').waitFor();
  await page.getByTestId('version-3').getByText(/pooled from 5 approved fits/).first().waitFor();
  await page.getByTestId('version-3').getByText('All five morning shots').waitFor();
  await screenshot(page, 'presets-published');

  const after = await readForecast(page, `${inject('baseUrl')}/t/${teamId}/forecast?preset=${presetId}`);
  expect(after.subtitle).toMatch(/version 3:/);
  expect(after.range).not.toBe(before.range);
  expect(parseFloat(after.range)).not.toBeNaN();
  await screenshot(page, 'presets-forecast-after');
  await context.close();
});
