// The whole hand-off chain in the browser with four people of a fresh team (so its
// queues hold only this test's work): the analyst uploads and calibrates; the frame
// marker finds the clip in their queue, marks it and hands it on; the engineer sees
// it in their queue and their mail, runs the fit, cannot approve their own fit (the
// page says why) and rejects it with a note that reaches the frame marker's mail;
// a second engineer approves the next fit from their queue.
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { APIRequestContext, Browser, BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD, demoPeopleOf, demoPerson } from '../../server/seed/demo-people';
import { OWN_FIT_APPROVAL_REASON } from '../../shared/schemas/team-settings';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { FIT_CLIP_OVERRIDES, conditionsForDensity, noisyTruthMarks } from '../support/fit-scenario';
import { jsonOf as json, uploadGeneratedClip } from '../support/generated-clip-upload';

const HEADERS = { 'X-Arcbench-Request': '1' };
const [dev, sana] = demoPeopleOf('engineer');
let browser: Browser;
const contexts: BrowserContext[] = [];
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  for (const c of contexts) await c.close().catch(() => {});
  await browser?.close();
});

async function signedIn(email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
  contexts.push(context);
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), email, DEMO_PASSWORD);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  return page;
}

/** The invitation link from the invitee's own mail; accepting with their password joins the team. */
async function join(request: APIRequestContext, baseUrl: string, teamName: string) {
  const mail = await json<{ items: { id: string; subject: string }[] }>(await request.get(`${baseUrl}/api/mail?page=1&pageSize=50`));
  const invite = mail.items.find((m) => m.subject.includes(teamName));
  if (!invite) throw new Error(`no invitation to ${teamName} in ${JSON.stringify(mail.items.map((m) => m.subject))}`);
  const message = await json<{ text: string }>(await request.get(`${baseUrl}/api/mail/${invite.id}`));
  const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(message.text)![1];
  await json(await request.post(`${baseUrl}/api/invitations/${token}/accept`, { headers: HEADERS, data: { password: DEMO_PASSWORD } }));
}

const queueBox = (page: Page, title: string) => page.getByRole('group', { name: title, exact: true });

/**
 * The shot's fit page lists every projectile track with its own button: the
 * workspace makes an empty "Projectile" track when the frame marker opens a clip
 * with no track yet, so it usually sits beside the "Ball" track that holds the
 * marks (its button off: too few marks). Pick the button of the track meant.
 */
const runFitButton = (page: Page, trackName: string) =>
  page.getByRole('listitem').filter({ hasText: trackName }).getByRole('button', { name: `Run fit on ${trackName}`, exact: true });

it('analyst → frame marker → engineer (mail, own fit not approvable, rejection) → second engineer approves', async () => {
  const baseUrl = inject('baseUrl');
  const suffix = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  const teamName = `Hand-off chain ${suffix}`;

  // ---- the admin makes a team of four
  const maren = await signedIn(demoPerson('admin').email);
  const team = await json<{ id: string }>(await maren.request.post(`${baseUrl}/api/teams`, { headers: HEADERS, data: { name: teamName } }));
  const teamId = team.id;
  const people = { tomas: demoPerson('analyst'), ines: demoPerson('tracker'), dev, sana };
  const roles = { tomas: 'analyst', ines: 'tracker', dev: 'engineer', sana: 'engineer' } as const;
  for (const key of Object.keys(people) as (keyof typeof people)[]) {
    await json(await maren.request.post(`${baseUrl}/api/teams/${teamId}/invitations`, { headers: HEADERS, data: { email: people[key].email, role: roles[key] } }));
  }
  const tomas = await signedIn(people.tomas.email);
  const ines = await signedIn(people.ines.email);
  const devPage = await signedIn(dev.email);
  const sanaPage = await signedIn(sana.email);
  for (const page of [tomas, ines, devPage, sanaPage]) {
    await join(page.request, baseUrl, teamName);
    await json(await page.request.patch(`${baseUrl}/api/auth/me`, { headers: HEADERS, data: { notificationMode: 'each' } }));
  }

  // The second engineer prefers one mail a day, chosen on the settings page.
  await sanaPage.goto(`${baseUrl}/settings`);
  await sanaPage.locator('label', { hasText: 'One e-mail a day' }).click();
  expect(await sanaPage.getByRole('radio', { name: 'One e-mail a day' }).isChecked()).toBe(true);
  await sanaPage.getByRole('button', { name: 'Save changes' }).click();
  await sanaPage.getByText('Saved.').waitFor();
  expect((await json<{ notificationMode: string }>(await sanaPage.request.get(`${baseUrl}/api/auth/me`))).notificationMode).toBe('digest');

  // ---- 1. the analyst uploads and calibrates
  const { clipId, truth } = await uploadGeneratedClip(tomas.request, baseUrl, teamId, 'clean', { ...FIT_CLIP_OVERRIDES });
  const clip = await json<{ shotId: string }>(await tomas.request.get(`${baseUrl}/api/teams/${teamId}/clips/${clipId}`));
  const shot = await json<{ label: string }>(await tomas.request.get(`${baseUrl}/api/teams/${teamId}/shots/${clip.shotId}`));
  const projectile = await json<{ id: string }>(
    await tomas.request.post(`${baseUrl}/api/teams/${teamId}/projectiles`, { headers: HEADERS, data: { name: `Foam ball ${suffix}`, massKg: truth.massKg, diameterM: truth.diameterM } }),
  );
  await json(
    await tomas.request.patch(`${baseUrl}/api/teams/${teamId}/shots/${clip.shotId}`, {
      headers: HEADERS,
      data: { projectileId: projectile.id, elevationDeg: truth.launchAngleDeg, ...conditionsForDensity(truth.airDensityKgM3) },
    }),
  );
  await tomas.goto(`${baseUrl}/t/${teamId}`);
  await queueBox(tomas, 'Clips to calibrate').getByRole('link', { name: shot.label }).waitFor();
  await json(
    await tomas.request.post(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/calibrations`, {
      headers: HEADERS,
      data: {
        scale: { p1: truth.scaleReference.p1, p2: truth.scaleReference.p2, lengthM: truth.scaleReference.lengthM, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
        origin: truth.originPx,
        level: { kind: 'line', p1: truth.levelLine.p1, p2: truth.levelLine.p2 },
        downrange: 'right',
      },
    }),
  );

  // ---- 2. the frame marker's queue shows the clip; they mark it and hand it on
  await ines.goto(`${baseUrl}/t/${teamId}`);
  const toMark = queueBox(ines, 'Calibrated clips with no marks');
  await toMark.getByRole('link', { name: shot.label }).waitFor();
  expect(await toMark.getByTestId('queue-count').textContent()).toBe('1');
  await screenshot(ines, 'hand-off-tracker-queue');
  await toMark.getByRole('link', { name: shot.label }).click();
  await ines.waitForURL(new RegExp(`/clips/${clipId}/workspace$`));
  // The marks go in through the API (the workspace's clicking has its own browser test).
  const track = await json<{ id: string }>(await ines.request.post(`${baseUrl}/api/teams/${teamId}/clips/${clipId}/tracks`, { headers: HEADERS, data: { name: 'Ball', kind: 'projectile' } }));
  for (const m of noisyTruthMarks(truth, 0.5, 21)) {
    await json(await ines.request.put(`${baseUrl}/api/teams/${teamId}/tracks/${track.id}/marks/${m.frameNumber}`, { headers: HEADERS, data: { uPx: m.uPx, vPx: m.vPx } }));
  }
  await ines.reload();
  const tracksCard = ines.getByRole('region', { name: 'Tracks' });
  await tracksCard.getByRole('button', { name: /^Ball/ }).click();
  await tracksCard.getByRole('button', { name: 'Ready for fitting' }).click();
  await tracksCard.getByText(/Handed to the engineers by Ines Varga/).waitFor();
  await screenshot(ines, 'hand-off-marking-done');

  // ---- 3. the engineer's queue and mail show it
  await devPage.goto(`${baseUrl}/t/${teamId}`);
  const readyToFit = queueBox(devPage, 'Marking done, no fit yet');
  await readyToFit.getByRole('link', { name: `${shot.label} · Ball` }).waitFor();
  await devPage.goto(`${baseUrl}/mail`);
  await devPage.getByRole('button', { name: `Marking done: ${shot.label}` }).waitFor();
  await screenshot(devPage, 'hand-off-engineer-mail');
  await devPage.goto(`${baseUrl}/t/${teamId}`);
  await readyToFit.getByRole('link', { name: `${shot.label} · Ball` }).click();
  await devPage.waitForURL(new RegExp(`/shots/${clip.shotId}/fits$`));
  await runFitButton(devPage, 'Ball').click();
  await devPage.getByRole('heading', { level: 1, name: /^Fit of/ }).waitFor({ timeout: 60_000 });

  // Separation of duties: the button is off and the page says why.
  const approve = devPage.getByRole('button', { name: 'Approve fit' });
  expect(await approve.isDisabled()).toBe(true);
  await devPage.getByText(OWN_FIT_APPROVAL_REASON).waitFor();
  await screenshot(devPage, 'hand-off-own-fit');

  // ---- 4. a rejection sends the note back to the frame marker
  const note = `Frames near the apex look late; re-mark them (${suffix}).`;
  await devPage.getByLabel('Note').fill(note);
  await devPage.getByRole('button', { name: 'Reject fit' }).click();
  await devPage.getByText(/Rejected by Dev Okafor/).waitFor();
  await ines.goto(`${baseUrl}/mail`);
  await ines.getByRole('button', { name: `Fit rejected: ${shot.label}` }).click();
  await ines.getByText(note).first().waitFor();
  await screenshot(ines, 'hand-off-rejection-mail');

  // ---- 5. the engineer runs the fit again; the other engineer approves it from their queue
  await devPage.goto(`${baseUrl}/t/${teamId}/shots/${clip.shotId}/fits`);
  await runFitButton(devPage, 'Ball').click();
  await devPage.getByRole('heading', { level: 1, name: /^Fit of/ }).waitFor({ timeout: 60_000 });
  const secondFitUrl = devPage.url();
  await sanaPage.goto(`${baseUrl}/t/${teamId}`);
  const awaiting = queueBox(sanaPage, 'Fits awaiting review');
  await awaiting.getByRole('link', { name: shot.label }).click();
  await sanaPage.waitForURL(secondFitUrl);
  await sanaPage.getByLabel('Note').fill('Second pair of eyes: residuals flat.');
  await sanaPage.getByRole('button', { name: 'Approve fit' }).click();
  await sanaPage.getByText(/Approved by Sana Quist/).waitFor();
  await screenshot(sanaPage, 'hand-off-approved');

  // The engineers' queues are empty again.
  await sanaPage.goto(`${baseUrl}/t/${teamId}`);
  expect(await queueBox(sanaPage, 'Fits awaiting review').getByTestId('queue-count').textContent()).toBe('0');
  expect(await queueBox(sanaPage, 'Marking done, no fit yet').getByTestId('queue-count').textContent()).toBe('0');
  // The demo engineer is shared with other tests: back to one mail per event.
  await json(await sanaPage.request.patch(`${baseUrl}/api/auth/me`, { headers: HEADERS, data: { notificationMode: 'each' } }));
}, 600_000);
