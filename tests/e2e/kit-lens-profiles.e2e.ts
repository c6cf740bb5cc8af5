// Team lens profiles on the kit page, in Debian's chromium against the real
// server: an engineer adds a profile (after being told plainly why folding
// coefficients cannot be kept), edits it and deletes it; a viewer sees the list
// but no way to change it. What the page shows is checked against what the API
// stores.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { demoTeamId, jsonOf } from '../support/generated-clip-upload';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

interface StoredProfile {
  id: string;
  name: string;
  coefficients: { k1: number; k2: number; k1StdUnc: number };
  frameWidthPx: number;
  frameHeightPx: number;
}

async function storedProfiles(page: Page, teamId: string): Promise<StoredProfile[]> {
  return jsonOf<StoredProfile[]>(await page.request.get(`${inject('baseUrl')}/api/teams/${teamId}/lens-profiles`));
}

async function openKit(role: 'engineer' | 'viewer') {
  const baseUrl = inject('baseUrl');
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const page = await context.newPage();
  await signIn(page, baseUrl, demoPerson(role).email, DEMO_PASSWORD);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  const teamId = await demoTeamId(page.request, baseUrl);
  await page.goto(`${baseUrl}/t/${teamId}/kit`);
  return { context, page, teamId };
}

it('an engineer adds, edits and deletes a lens profile; folding coefficients get a plain message and are not stored', async () => {
  const name = `Wide action cam ${Date.now().toString(36)}`;
  const { context, page, teamId } = await openKit('engineer');
  await page.getByRole('button', { name: 'New lens profile' }).click();
  const dialog = page.getByRole('dialog', { name: 'New lens profile' });
  await dialog.getByLabel('Name').fill(name);
  await dialog.getByLabel(/^Camera, lens and mode/).fill('2.7K, 120 fps');
  // k1 = −0.5 folds the picture: r(1 − 0.5 r²) turns back at r = 0.816, inside the corner (r_d = 0.54 < 1).
  await dialog.getByLabel(/^k1 \(/).fill('-0.5');
  await dialog.getByLabel(/^k1 standard uncertainty/).fill('0.004');
  await dialog.getByLabel(/^Frame width/).fill('2704');
  await dialog.getByLabel(/^Frame height/).fill('1520');
  await dialog.getByRole('button', { name: 'Add lens profile' }).click();
  await dialog.getByText(/fold the image/).waitFor();
  expect((await storedProfiles(page, teamId)).some((p) => p.name === name)).toBe(false);

  await dialog.getByLabel(/^k1 \(/).fill('-0.14');
  await dialog.getByRole('button', { name: 'Add lens profile' }).click();
  await dialog.waitFor({ state: 'hidden' });
  const row = page.getByRole('table', { name: 'Lens profiles' }).getByRole('row').filter({ hasText: name });
  await row.waitFor();
  const rowText = (await row.textContent())!.replace(/\u2212/g, '-');
  // formatNumber: k1 to 4 significant digits, its σ to 2.
  expect(rowText).toContain('-0.1400 ± 0.0040');
  expect(rowText).toContain('2704×1520');
  const stored = (await storedProfiles(page, teamId)).find((p) => p.name === name)!;
  expect(stored.coefficients).toMatchObject({ k1: -0.14, k2: 0, k1StdUnc: 0.004 });
  expect([stored.frameWidthPx, stored.frameHeightPx]).toEqual([2704, 1520]);
  await screenshot(page, 'kit-lens-profile-added');

  await row.getByRole('button', { name: 'Edit' }).click();
  const edit = page.getByRole('dialog', { name: `Edit ${name}` });
  await edit.getByLabel(/^k2 \(/).fill('0.02');
  await edit.getByRole('button', { name: 'Save changes' }).click();
  await edit.waitFor({ state: 'hidden' });
  await expect.poll(async () => (await storedProfiles(page, teamId)).find((p) => p.name === name)?.coefficients.k2).toBe(0.02);
  await row.filter({ hasText: '0.02' }).waitFor();

  await row.getByRole('button', { name: 'Delete' }).click();
  await page.getByRole('dialog', { name: `Delete ${name}?` }).getByRole('button', { name: 'Delete' }).click();
  await row.waitFor({ state: 'detached' });
  expect((await storedProfiles(page, teamId)).some((p) => p.name === name)).toBe(false);
  await context.close();
});

it('a viewer sees the lens profiles but no button to add, edit or delete one', async () => {
  const { context, page, teamId } = await openKit('viewer');
  await page.getByRole('table', { name: 'Lens profiles' }).waitFor();
  // The list is the team's, as the API gives it to a viewer.
  const names = (await storedProfiles(page, teamId)).map((p) => p.name);
  for (const n of names) await page.getByRole('table', { name: 'Lens profiles' }).getByRole('row').filter({ hasText: n }).first().waitFor();
  expect(await page.getByRole('button', { name: 'New lens profile' }).count()).toBe(0);
  const table = page.getByRole('table', { name: 'Lens profiles' });
  expect(await table.getByRole('button', { name: 'Edit' }).count()).toBe(0);
  expect(await table.getByRole('button', { name: 'Delete' }).count()).toBe(0);
  await context.close();
});
