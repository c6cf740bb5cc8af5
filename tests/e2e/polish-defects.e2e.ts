// Rough edges a new user tripped over, each checked in Debian's chromium against the
// demo team: what a viewer is offered on a clip, the keyboard help opening at its title,
// the residual chart's axis label inside the chart, the keep-out panel's one headline
// number, and a server field error shown beside its field in plain words.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { DEMO_PRESET_NAMES } from '../../server/seed/demo-presets';
import { launchBrowser, screenshot, signIn } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function signedIn(role: Parameters<typeof demoPerson>[0], viewport = { width: 1280, height: 900 }): Promise<{ page: Page; teamId: string }> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), demoPerson(role).email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}/);
  const me = (await (await page.request.get(`${inject('baseUrl')}/api/auth/me`)).json()) as { teams: { id: string; slug: string }[] };
  return { page, teamId: me.teams.find((team) => team.slug === DEMO_TEAM.slug)!.id };
}

async function readyClip(page: Page, teamId: string): Promise<{ shotId: string; clipId: string }> {
  const list = (await (await page.request.get(`${inject('baseUrl')}/api/teams/${teamId}/shots?pageSize=100`)).json()) as {
    items: { id: string; latestClip: { id: string; status: string } | null }[];
  };
  const shot = list.items.find((s) => s.latestClip?.status === 'ready')!;
  expect(shot).toBeTruthy();
  return { shotId: shot.id, clipId: shot.latestClip!.id };
}

it('a viewer is offered to look at the marks, not to mark the clip', async () => {
  const { page, teamId } = await signedIn('viewer');
  const { shotId } = await readyClip(page, teamId);
  await page.goto(`${inject('baseUrl')}/t/${teamId}/shots/${shotId}`);
  await page.getByRole('link', { name: 'View the marks' }).waitFor();
  expect(await page.getByRole('link', { name: 'Mark this clip' }).count()).toBe(0);
  await page.context().close();
});

it('the keyboard help opens at its title, even in a short window', async () => {
  const { page, teamId } = await signedIn('tracker', { width: 1024, height: 560 });
  const { clipId } = await readyClip(page, teamId);
  await page.goto(`${inject('baseUrl')}/t/${teamId}/clips/${clipId}/workspace`);
  await page.getByRole('button', { name: /^Keys/ }).click();
  const dialog = page.getByRole('dialog', { name: 'Keys in the workspace' });
  const title = dialog.getByRole('heading', { name: 'Keys in the workspace' });
  await title.waitFor();
  const titleBox = (await title.boundingBox())!;
  const dialogBox = (await dialog.boundingBox())!;
  expect(titleBox.y).toBeGreaterThanOrEqual(dialogBox.y);
  expect(titleBox.y + titleBox.height).toBeLessThanOrEqual(560);
  // The dialog fits the window; only its list scrolls, and the Close button is in view too.
  expect(dialogBox.y + dialogBox.height).toBeLessThanOrEqual(560);
  expect(await dialog.evaluate((el) => el.scrollTop)).toBe(0);
  const close = (await dialog.getByRole('button', { name: 'Close' }).boundingBox())!;
  expect(close.y + close.height).toBeLessThanOrEqual(560);
  await screenshot(page, 'polish-keys-dialog');
  await page.context().close();
});

it('the residual chart keeps its axis label inside the chart, and a rejection without a note says so beside the note', async () => {
  const { page, teamId } = await signedIn('engineer');
  await page.goto(`${inject('baseUrl')}/t/${teamId}/results`);
  await page.getByLabel('Status').selectOption('awaiting-review');
  const row = page.getByRole('row').filter({ has: page.getByText('Awaiting review') }).first();
  await row.waitFor();
  await row.getByText('Awaiting review').click();
  await page.waitForURL(/\/fits\/[0-9a-f-]{36}$/);
  const chart = page.locator('[data-chart="residuals"]');
  const label = chart.getByText('residual (mm)');
  await label.waitFor();
  // The chart's own box (legend icons are small svgs of the same class, so the figure is measured instead).
  const svg = (await chart.boundingBox())!;
  const text = (await label.boundingBox())!;
  expect(text.x).toBeGreaterThanOrEqual(svg.x);
  expect(text.y).toBeGreaterThanOrEqual(svg.y);
  expect(text.y + text.height).toBeLessThanOrEqual(svg.y + svg.height);

  // Reject with an empty note: the server's field error lands on the note, in plain words.
  await page.getByRole('button', { name: 'Reject fit' }).click();
  const note = page.getByLabel('Note');
  await page.getByText('Is required when rejecting.').waitFor();
  expect(await note.getAttribute('aria-invalid')).toBe('true');
  const alert = page.getByRole('alert').filter({ hasText: 'Check the field marked below.' });
  await alert.waitFor();
  expect(await page.getByText(/Invalid request body/).count()).toBe(0);
  await screenshot(page, 'polish-reject-without-note');
  await page.context().close();
});

it('the keep-out distance is the one large number; the vacuum ceiling is secondary and explained', async () => {
  const { page, teamId } = await signedIn('engineer');
  await page.goto(`${inject('baseUrl')}/t/${teamId}/presets`);
  await page.getByRole('link', { name: DEMO_PRESET_NAMES.lt40 }).click();
  const keepOut = page.getByTestId('keep-out-distance');
  await keepOut.waitFor();
  const ceiling = page.getByTestId('vacuum-ceiling');
  const size = (el: typeof keepOut) => el.evaluate((node) => parseFloat(getComputedStyle(node).fontSize));
  expect(await size(ceiling)).toBeLessThan((await size(keepOut)) / 1.5);
  await expect(page.getByTestId('vacuum-ceiling-line').textContent()).resolves.toMatch(/with no air at all/);
  await page.context().close();
});
