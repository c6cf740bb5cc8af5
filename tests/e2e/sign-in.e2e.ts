import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';

// The signed-in journey through the real server, built client and demo
// database: the analyst reaches the team home, a wrong password is explained
// in words, and signing out really ends the session (the server, not just the
// client, refuses the next page).
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

async function freshPage(): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1360, height: 900 } });
  return context.newPage();
}

describe('sign-in', () => {
  const analyst = demoPerson('analyst');

  it('takes the analyst to the team home with the team name and the role', async () => {
    const page = await freshPage();
    const baseUrl = inject('baseUrl');
    await signIn(page, baseUrl, analyst.email, DEMO_PASSWORD);
    await page.waitForURL(/\/t\/[0-9a-f-]{36}$/);
    // A browser that remembers no team opens the first of the person's teams by name
    // (src/app/home-redirect.tsx). Other browser tests put the demo people in teams of
    // their own (the hand-off chain's team sorts before the demo team), so the landing
    // team is read from the server rather than assumed.
    const me = (await (await page.request.get(`${baseUrl}/api/auth/me`)).json()) as { teams: { id: string; name: string; slug: string }[] };
    const first = me.teams[0];
    expect(new URL(page.url()).pathname).toBe(`/t/${first.id}`);
    // Wait for the heading itself: the URL changes a moment before the new page renders.
    await page.getByRole('heading', { level: 1, name: first.name, exact: true }).waitFor();

    // The demo team, chosen in the top bar's team switcher when sign-in opened another.
    const demoTeam = me.teams.find((team) => team.slug === DEMO_TEAM.slug)!;
    if (demoTeam.id !== first.id) {
      await page.getByRole('combobox', { name: /^Team/ }).selectOption(demoTeam.id);
      await page.waitForURL(new RegExp(`/t/${demoTeam.id}$`));
    }
    await page.getByRole('heading', { level: 1, name: DEMO_TEAM.name, exact: true }).waitFor();
    const role = page.getByRole('region', { name: 'Your role' });
    await expect(role.getByText('Analyst', { exact: true }).isVisible()).resolves.toBe(true);
    await expect(page.getByText(DEMO_TEAM.siteName).first().isVisible()).resolves.toBe(true);
    // The analyst is not an admin: the admin-only outbox is not offered in the navigation.
    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect(nav.getByRole('link', { name: 'Members' }).count()).resolves.toBe(1);
    await expect(nav.getByRole('link', { name: 'Outbox' }).count()).resolves.toBe(0);
    await expect(page.getByText('Planning aid only — follow your range-safety rules, local codes and licensed practice.').isVisible()).resolves.toBe(true);
    await screenshot(page, 'team-home-analyst');
    await page.context().close();
  });

  it('explains a wrong password in plain words and stays on the sign-in page', async () => {
    const page = await freshPage();
    const baseUrl = inject('baseUrl');
    await signIn(page, baseUrl, analyst.email, 'not-the-password');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toContain('That e-mail and password do not match an account');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password');
    await page.context().close();
  });

  it('sends a signed-out visitor to sign-in and back to the page asked for', async () => {
    const page = await freshPage();
    const baseUrl = inject('baseUrl');
    await page.goto(`${baseUrl}/settings`);
    await page.waitForURL(/\/sign-in\?next=%2Fsettings$/);
    await page.getByLabel('E-mail').fill(analyst.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/settings`);
    await expect(page.getByLabel('Display name').inputValue()).resolves.toBe(analyst.displayName);
    await screenshot(page, 'settings-analyst');
    await page.context().close();
  });

  it('answers an unknown address with a plain "no page here" inside the shell', async () => {
    const page = await freshPage();
    const baseUrl = inject('baseUrl');
    await signIn(page, baseUrl, analyst.email, DEMO_PASSWORD);
    await page.waitForURL(/\/t\//);
    await page.goto(`${baseUrl}/no/such/page`);
    await page.getByText('There is no page here').waitFor();
    await expect(page.getByRole('link', { name: 'Go to my team' }).isVisible()).resolves.toBe(true);
    await page.goto(`${baseUrl}/mail`);
    await page.getByRole('heading', { level: 1, name: 'My mail' }).waitFor();
    // The e2e server runs without SMTP, so the page must say mail is kept locally.
    await page.getByText('No SMTP server is configured').waitFor();
    await screenshot(page, 'my-mail-analyst');
    await page.context().close();
  });

  it('signs out from the user menu, back to sign-in, and the session is gone on the server', async () => {
    const page = await freshPage();
    const baseUrl = inject('baseUrl');
    await signIn(page, baseUrl, analyst.email, DEMO_PASSWORD);
    await page.waitForURL(/\/t\//);
    await page.getByRole('button', { name: analyst.displayName }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl}/sign-in`);
    const status = await page.evaluate(async () => (await fetch('/api/auth/me')).status);
    expect(status).toBe(401);
    // Back to a team page: the guard sends us to sign-in again.
    await page.goto(`${baseUrl}/settings`);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.context().close();
  });
});
