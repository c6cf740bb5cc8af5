// A 768 px wide window (a tablet held upright, or half a laptop screen) in Debian's
// chromium: the side navigation folds into a menu opened by a real button that says
// whether it is open, and a table wider than its card scrolls inside the card with its
// first column pinned, while the page itself never scrolls sideways.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function demoTeam(page: Page): Promise<string> {
  const me = (await (await page.request.get(`${inject('baseUrl')}/api/auth/me`)).json()) as { teams: { id: string; slug: string }[] };
  return me.teams.find((team) => team.slug === DEMO_TEAM.slug)!.id;
}

const pageScrollsSideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);

it('at 768 px the side navigation is a menu and wide tables scroll inside their card with the first column pinned', async () => {
  const context = await browser.newContext({ viewport: { width: 768, height: 1000 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), demoPerson('engineer').email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}/);
  const teamId = await demoTeam(page);
  await page.goto(`${inject('baseUrl')}/t/${teamId}`);

  // Folded: the navigation is out of the way and the menu button says it is closed.
  const menu = page.getByRole('button', { name: 'Menu' });
  await menu.waitFor();
  expect(await menu.getAttribute('aria-expanded')).toBe('false');
  expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
  expect(await pageScrollsSideways(page)).toBe(false);

  // Opened: the team's pages are there; following one goes there and folds the menu again.
  await menu.click();
  expect(await menu.getAttribute('aria-expanded')).toBe('true');
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.waitFor();
  await screenshot(page, 'narrow-menu-open');
  await nav.getByRole('link', { name: 'Launchers & projectiles' }).click();
  await page.waitForURL(new RegExp(`/t/${teamId}/kit$`));
  expect(await menu.getAttribute('aria-expanded')).toBe('false');
  expect(await nav.isVisible()).toBe(false);

  // The launchers table has more columns than 768 px hold: it scrolls inside its card.
  const table = page.getByRole('table').first();
  await table.locator('tbody tr').first().waitFor();
  const scroller = table.locator('xpath=ancestor::div[@data-table-scroll][1]');
  const sizes = await scroller.evaluate((el) => ({ scrollWidth: el.scrollWidth, clientWidth: el.clientWidth }));
  expect(sizes.scrollWidth).toBeGreaterThan(sizes.clientWidth);
  expect(await pageScrollsSideways(page)).toBe(false);

  const firstCell = table.locator('tbody tr').first().locator('td').first();
  const secondCell = table.locator('tbody tr').first().locator('td').nth(1);
  const firstHeader = table.locator('thead th').first();
  const before = { cell: (await firstCell.boundingBox())!, next: (await secondCell.boundingBox())!, head: (await firstHeader.boundingBox())! };
  await scroller.evaluate((el) => el.scrollTo({ left: el.scrollWidth }));
  const after = { cell: (await firstCell.boundingBox())!, next: (await secondCell.boundingBox())!, head: (await firstHeader.boundingBox())! };
  // The first column (cells and header) stays put; the others moved under it.
  expect(Math.abs(after.cell.x - before.cell.x)).toBeLessThan(1);
  expect(Math.abs(after.head.x - before.head.x)).toBeLessThan(1);
  expect(after.next.x).toBeLessThan(before.next.x - 20);
  // And the pinned cell is drawn on top of the scrolled ones (it has an opaque background).
  const onTop = await firstCell.evaluate((el) => {
    const box = el.getBoundingClientRect();
    const hit = document.elementFromPoint(box.left + box.width / 2, box.top + box.height / 2);
    return el.contains(hit);
  });
  expect(onTop).toBe(true);
  await screenshot(page, 'narrow-table-scrolled');
  await context.close();
});

it('from 1024 px the side navigation is always shown and there is no menu button', async () => {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), demoPerson('engineer').email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}/);
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
  expect(await page.getByRole('button', { name: 'Menu' }).isVisible()).toBe(false);
  await context.close();
});
