import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';

// An admin's round trip through the real server and the local mail fake:
// invite a newcomer from the members page, read the invitation in the team
// outbox, follow its link in a fresh browser, create the account and arrive
// in the team with the invited role. The last-admin rule is shown in words;
// a person removed from their only team can start their own.
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

const suffix = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const newcomer = { email: `newcomer-${suffix}@ollendry.test`, name: `Rui Newcomer ${suffix}`, password: 'a long enough phrase 42' };

it('invites a tracker, shows the mail in the outbox, and the link makes a member with that role', async () => {
  const baseUrl = inject('baseUrl');
  const admin = demoPerson('admin');
  const page = await (await browser.newContext({ viewport: { width: 1360, height: 900 } })).newPage();
  await signIn(page, baseUrl, admin.email, DEMO_PASSWORD);
  await page.waitForURL(/\/t\/[0-9a-f-]{36}$/);
  // API tests may have made the demo admin a member of teams of their own, so
  // open the demo team explicitly rather than whichever team sign-in lands on.
  const me = (await (await page.request.get(`${baseUrl}/api/auth/me`)).json()) as { teams: { id: string; slug: string }[] };
  const demoTeamId = me.teams.find((team) => team.slug === DEMO_TEAM.slug)!.id;
  await page.goto(`${baseUrl}/t/${demoTeamId}`);
  await page.getByRole('heading', { level: 1, name: DEMO_TEAM.name, exact: true }).waitFor();
  const nav = page.getByRole('navigation', { name: 'Main' });

  await nav.getByRole('link', { name: 'Members' }).click();
  await page.getByRole('table', { name: 'Members' }).getByRole('button', { name: `Remove ${demoPerson('analyst').displayName}` }).waitFor();

  // Sorting by a header reorders the rows and says so to assistive tech (aria-sort).
  const membersTable = page.getByRole('table', { name: 'Members' });
  const emails = () => membersTable.locator('tbody tr td:nth-child(2)').allTextContents();
  const before = await emails();
  await membersTable.getByRole('button', { name: 'E-mail' }).click();
  await expect(membersTable.getByRole('columnheader', { name: 'E-mail' }).getAttribute('aria-sort')).resolves.toBe('ascending');
  await expect(emails()).resolves.toEqual([...before].sort((a, b) => a.localeCompare(b)));

  // The demo team has one admin: her own role menu is disabled, and the page says why.
  const ownRole = page.getByLabel(`Role of ${admin.displayName}`);
  expect(await ownRole.isDisabled()).toBe(true);
  const reasonId = await ownRole.getAttribute('aria-describedby');
  expect(reasonId).toBeTruthy();
  await expect(page.locator(`[id="${reasonId}"]`).textContent()).resolves.toContain('only admin');
  await expect(ownRole.inputValue()).resolves.toBe('admin');

  const invite = page.getByRole('region', { name: 'Invite someone' });
  await invite.getByLabel('E-mail').fill(newcomer.email);
  await invite.getByLabel('Role').selectOption('tracker');
  await invite.getByRole('button', { name: 'Send invitation' }).click();
  await invite.getByRole('status').filter({ hasText: `Invitation sent to ${newcomer.email}` }).waitFor();
  const row = page.getByRole('table', { name: 'Invitations' }).getByRole('row').filter({ hasText: newcomer.email });
  await expect(row.getByText('Waiting').isVisible()).resolves.toBe(true);
  await screenshot(page, 'members-admin');

  // Revoking asks first; Escape backs out and changes nothing (revoking for real comes at the end).
  await row.getByRole('button', { name: `Revoke invitation for ${newcomer.email}` }).click();
  const dialog = page.getByRole('dialog', { name: `Revoke the invitation for ${newcomer.email}?` });
  await dialog.waitFor();
  await screenshot(page, 'revoke-dialog');
  await page.keyboard.press('Escape');
  await dialog.waitFor({ state: 'hidden' });
  await expect(row.getByText('Waiting').isVisible()).resolves.toBe(true);

  await nav.getByRole('link', { name: 'Outbox' }).click();
  const outbox = page.getByRole('table', { name: 'Team outbox' });
  await outbox.getByRole('row').filter({ hasText: newcomer.email }).first().getByRole('button').click();
  const message = page.getByRole('article');
  const link = message.getByRole('link', { name: /\/invite\// });
  const href = await link.getAttribute('href');
  expect(href).toMatch(/\/invite\/[A-Za-z0-9_-]{20,}$/);
  await screenshot(page, 'outbox-message');

  // The newcomer opens the link in their own browser (no session).
  const guest = await (await browser.newContext({ viewport: { width: 1360, height: 900 } })).newPage();
  await guest.goto(`${baseUrl}${new URL(href!).pathname}`);
  await guest.getByRole('heading', { name: `Join ${DEMO_TEAM.name}` }).waitFor();
  await guest.getByLabel('Your name').fill(newcomer.name);
  await guest.getByLabel('Password', { exact: true }).fill(newcomer.password);
  await guest.getByLabel('Password again').fill(newcomer.password);
  await screenshot(guest, 'invitation-accept');
  await guest.getByRole('button', { name: 'Create account and join' }).click();
  await guest.waitForURL(/\/t\/[0-9a-f-]{36}$/);
  // Wait for the heading itself: the URL changes a moment before the new page renders.
  await guest.getByRole('heading', { level: 1, name: DEMO_TEAM.name, exact: true }).waitFor();
  await expect(guest.getByRole('region', { name: 'Your role' }).getByText('Frame marker', { exact: true }).isVisible()).resolves.toBe(true);

  // Opening the same link again now says plainly that it was used.
  await guest.goto(`${baseUrl}${new URL(href!).pathname}`);
  await guest.getByRole('heading', { name: 'This invitation has already been used' }).waitFor();

  // The admin invites someone else and revokes it through the confirm dialog.
  const other = `second-${suffix}@ollendry.test`;
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).click();
  const inviteAgain = page.getByRole('region', { name: 'Invite someone' });
  await inviteAgain.getByLabel('E-mail').fill(other);
  await inviteAgain.getByRole('button', { name: 'Send invitation' }).click();
  await inviteAgain.getByRole('status').filter({ hasText: `Invitation sent to ${other}` }).waitFor();
  const otherRow = page.getByRole('table', { name: 'Invitations' }).getByRole('row').filter({ hasText: other });
  await otherRow.getByRole('button', { name: `Revoke invitation for ${other}` }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Revoke', exact: true }).click();
  await otherRow.getByText('Revoked').waitFor();
  // The newcomer is now listed as a member, with the invited role.
  await expect(page.getByLabel(`Role of ${newcomer.name}`).inputValue()).resolves.toBe('tracker');
  // Making someone an admin waits for a confirmation; cancelled, nothing changes.
  await page.getByLabel(`Role of ${newcomer.name}`).selectOption('admin');
  const promote = page.getByRole('dialog', { name: `Make ${newcomer.name} an admin of` });
  await promote.getByRole('button', { name: 'Make admin' }).waitFor();
  await promote.getByRole('button', { name: 'Cancel' }).click();
  await expect(page.getByLabel(`Role of ${newcomer.name}`).inputValue()).resolves.toBe('tracker');

  // Removing the newcomer (confirmed in a dialog) leaves them with no team: "/" then offers to start one.
  await page.getByRole('button', { name: `Remove ${newcomer.name}` }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Remove', exact: true }).click();
  await page.getByRole('button', { name: `Remove ${newcomer.name}` }).waitFor({ state: 'detached' });
  await guest.goto(`${baseUrl}/`);
  await guest.getByRole('heading', { level: 1, name: 'No team yet' }).waitFor();
  await screenshot(guest, 'no-team-yet');
  const ownTeam = `Rui test rig ${suffix}`;
  await guest.getByLabel('Team name').fill(ownTeam);
  await guest.getByLabel('Test site').fill('Workshop yard');
  await guest.getByRole('button', { name: 'Create team' }).click();
  await guest.getByRole('heading', { level: 1, name: ownTeam }).waitFor();
  await expect(guest.getByRole('region', { name: 'Your role' }).getByText('Admin', { exact: true }).isVisible()).resolves.toBe(true);

  await page.context().close();
  await guest.context().close();
});
