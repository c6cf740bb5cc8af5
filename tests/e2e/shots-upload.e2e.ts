// From an empty series to frames on screen, in Debian's chromium against the
// real server, database, job worker and ffmpeg: the demo analyst creates a
// series and a shot through the forms, uploads a generated slow-motion clip
// (captured at 240 fps, written to play at 30), follows the extraction to the
// end and steps through the frames. Frame count and frame times are checked
// against the generator's truth file; a frame's time is n / capture rate by
// definition of a constant frame rate. On a throttled link the upload bar
// shows bytes as they go, and cancelling stores nothing.
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { launchBrowser, screenshot, signIn } from '../support/browser';
import { demoTeamId } from '../support/generated-clip-upload';

let browser: Browser;
let clip: GeneratedClip;
let workDir: string;
const suffix = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

beforeAll(async () => {
  workDir = mkdtempSync(path.join(process.env.ARCBENCH_TMP ?? os.tmpdir(), 'shots-upload-'));
  [browser, clip] = await Promise.all([launchBrowser(), generatePreset('slowmo', workDir, { frameCount: 48 })]);
});
afterAll(() => browser?.close());

async function analystPage(): Promise<{ page: Page; teamId: string }> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1100 } });
  const page = await context.newPage();
  await signIn(page, inject('baseUrl'), demoPerson('analyst').email, DEMO_PASSWORD);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  return { page, teamId: await demoTeamId(page.request, inject('baseUrl')) };
}

it('creates a series and a shot, uploads a clip, watches extraction finish and steps through the frames', async () => {
  const { page, teamId } = await analystPage();
  const base = inject('baseUrl');
  const seriesName = `North lane ${suffix}`;
  const label = `LT40-${suffix}`;

  // A new series through its dialog.
  await page.goto(`${base}/t/${teamId}/series`);
  await page.getByRole('button', { name: 'New series' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Name').fill(seriesName);
  await dialog.getByLabel('Test date').fill('2026-04-20');
  await dialog.getByRole('button', { name: 'Create series' }).click();
  const row = page.getByRole('row').filter({ hasText: seriesName });
  await row.waitFor();

  // A shot in it, conditions typed in the gauge units the form offers.
  await row.getByRole('link', { name: 'Add shot' }).click();
  await page.waitForURL(/\/shots\/new/);
  await page.getByLabel('Label').fill(label);
  await page.getByLabel('Launcher').selectOption({ label: 'Ollendry OL-40 line thrower' });
  await page.getByLabel('Chamber pressure (kPa)').fill('650');
  await page.getByLabel('Elevation setting (°)').fill('35');
  await page.getByLabel('Air temperature (°C)').fill('11.5');
  await page.getByLabel('Station pressure (kPa)').fill('100.87');
  await page.getByLabel('Relative humidity (%)').fill('71');
  await page.getByRole('button', { name: 'Save shot' }).click();
  await page.waitForURL(new RegExp(`/t/${teamId}/shots/[0-9a-f-]{36}$`));
  const shotId = page.url().split('/').pop()!;

  // Stored in SI as the API contract says: 650 kPa = 650 000 Pa, 100.87 kPa = 100 870 Pa (kPa is the one pressure unit of the app).
  const shot = await (await page.request.get(`${base}/api/teams/${teamId}/shots/${shotId}`)).json();
  expect(shot).toMatchObject({ label, seriesName, chamberPressurePa: 650_000, stationPressurePa: 100_870, elevationDeg: 35, launcherName: 'Ollendry OL-40 line thrower' });

  // A file that is not a video is refused with the server's reason on screen, and nothing is stored.
  const fake = path.join(workDir, 'notes.mp4');
  writeFileSync(fake, 'wind 2 m/s from the west, gusting\n'.repeat(40));
  await page.getByLabel('Clip file').setInputFiles(fake);
  await page.getByLabel('Capture frame rate').fill('240');
  await page.getByRole('button', { name: 'Upload clip' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'not a video' }).first().textContent()).resolves.toMatch(/notes\.mp4 is not a video/);
  expect(await (await page.request.get(`${base}/api/teams/${teamId}/shots/${shotId}/clips`)).json()).toEqual([]);

  // On a slow link the bar reports bytes as they go, and a cancelled upload stores nothing.
  // Chromium's network emulation (DevTools protocol) throttles the upload to about 8 kB/s, slow enough that the cancel lands mid-way.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 8 * 1024 });
  await page.getByLabel('Clip file').setInputFiles(clip.videoPath);
  await page.getByLabel('Capture frame rate').fill(String(clip.truth.captureFps));
  await page.getByRole('button', { name: 'Upload clip' }).click();
  const bar = page.getByRole('progressbar', { name: 'Uploading' });
  await page.waitForFunction(() => {
    const el = document.querySelector('[role="progressbar"][aria-label="Uploading"]');
    const now = Number(el?.getAttribute('aria-valuenow'));
    return now > 0 && now < 100;
  });
  await expect(bar.getAttribute('aria-valuetext')).resolves.toMatch(/kB of 1\d\d(\.\d)?\skB/);
  await page.getByRole('button', { name: 'Cancel upload' }).click();
  await page.getByText('Upload cancelled; nothing was stored.').waitFor();
  expect(await (await page.request.get(`${base}/api/teams/${teamId}/shots/${shotId}/clips`)).json()).toEqual([]);
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

  // The real clip, at full speed.
  await page.getByLabel('Clip file').setInputFiles(clip.videoPath);
  await page.getByLabel('Capture frame rate').fill(String(clip.truth.captureFps));
  await page.getByRole('button', { name: 'Upload clip' }).click();
  await page.getByText('Frames ready').waitFor({ timeout: 90_000 });
  await page.getByText(`${clip.truth.frameCount} frames extracted`).waitFor();

  // The time base says what the file claims and what was stated, and warns that they differ.
  const note = page.getByRole('note').filter({ hasText: 'slow motion' });
  await expect(note.textContent()).resolves.toMatch(/plays at 30\sfps.*captured at 240\sfps \(8× slow motion\)/);

  // Frames: count and times against the truth file.
  const position = page.getByTestId('frame-position');
  await expect(position.textContent()).resolves.toMatch(new RegExp(`Frame 0 · 1 of ${clip.truth.frameCount} · t = 0\\.00\\sms`));
  await page.getByRole('button', { name: 'Next frame' }).click();
  await page.getByRole('button', { name: 'Next frame' }).click();
  const t2Ms = (clip.truth.frames[2].tS * 1000).toFixed(2); // 2 / 240 s = 8.33 ms
  expect(t2Ms).toBe('8.33');
  await page.getByText(`t = ${t2Ms}`, { exact: false }).waitFor();
  await expect(position.textContent()).resolves.toMatch(/^Frame 2 · 3 of/);
  const frame = page.getByRole('img', { name: /^Frame 2 of / });
  await frame.waitFor();
  await page.waitForFunction(() => {
    const img = document.querySelector<HTMLImageElement>('img[alt^="Frame 2 of"]');
    return !!img && img.complete && img.naturalWidth > 0;
  });
  expect(await frame.evaluate((img: HTMLImageElement) => [img.naturalWidth, img.naturalHeight])).toEqual([clip.truth.width, clip.truth.height]);
  expect(await page.getByRole('link', { name: 'Mark this clip' }).getAttribute('href')).toMatch(new RegExp(`/t/${teamId}/clips/[0-9a-f-]{36}/workspace$`));
  await screenshot(page, 'shots-upload-frames');

  // The team-wide shot list shows the clip as ready.
  await page.goto(`${base}/t/${teamId}/shots?q=${encodeURIComponent(label)}`);
  const listed = page.getByRole('row').filter({ hasText: label });
  await listed.getByText('frames ready').waitFor();
  await expect(listed.textContent()).resolves.toContain(seriesName);
  await screenshot(page, 'shots-list');
});
