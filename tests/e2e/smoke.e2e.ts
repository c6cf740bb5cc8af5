import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, screenshot } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

it('serves the built client', async () => {
  const page = await browser.newPage();
  await page.goto(inject('baseUrl'));
  await expect(page.title()).resolves.toBe('Arcbench');
  await screenshot(page, 'smoke');
});
