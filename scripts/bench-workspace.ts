// Frame-step latency of the workspace in headless chromium: keydown (→) to
// the new frame drawn on the frame layer, over 200 steps between frames that
// are already decoded in the frame cache. Target: p95 <= 16 ms (one frame at
// 60 Hz). Baseline in the same run: a keydown that changes nothing, to the
// next animation frame — the browser's own floor for "react to a key".
// Then a marking click: mousedown with the place tool until the next frame
// is drawn, over 50 clicks while each mark's save is held in flight for
// 400 ms (the save runs in the background), p95 <= 16 ms too; its baseline is
// a mousedown that changes nothing, to the next animation frame. Clicks come
// at a person's pace: the next one once the page is idle again (a person
// clicking along a flight needs well over 100 ms per frame).
// Run alone: npx tsx scripts/bench-workspace.ts (needs DATABASE_URL and a
// built client, as `npm run bench` provides).
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoPerson } from '../server/seed/demo-people';
import { startAppServer } from '../tests/support/app-server';
import { launchBrowser, signIn } from '../tests/support/browser';
import { demoTeamId, uploadGeneratedClip } from '../tests/support/generated-clip-upload';

const STEPS = 200;
const TARGET_P95_MS = 16;
const CLIP_FRAMES = 60; // fits the frame cache (64) whole, so every step lands on a decoded frame
const CLICKS = 50;
const SAVE_HELD_MS = 400;
const HEADERS = { 'X-Arcbench-Request': '1' };

function quantile(values: number[], q: number): number {
  const s = [...values].sort((a, b) => a - b);
  const i = (s.length - 1) * q;
  const lo = Math.floor(i);
  return s[lo] + (s[Math.min(lo + 1, s.length - 1)] - s[lo]) * (i - lo);
}

async function startServer(): Promise<{ url: string; stop: () => Promise<void> }> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run through `npm run bench`, which starts a throwaway database.');
  return startAppServer();
}

const shownFrame = (page: Page) => page.evaluate(() => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame ?? '');

async function waitShown(page: Page, frameNumber: number) {
  await page.waitForFunction((n) => document.querySelector<HTMLElement>('[data-testid="frame-stage"]')?.dataset.shownFrame === String(n), frameNumber);
}

export async function benchWorkspace(baseUrl?: string): Promise<string> {
  const server = baseUrl ? null : await startServer();
  const url = baseUrl ?? server!.url;
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
    const page = await context.newPage();
    await signIn(page, url, demoPerson('analyst').email, DEMO_PASSWORD);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const teamId = await demoTeamId(page.request, url);
    const { clipId } = await uploadGeneratedClip(page.request, url, teamId, 'clean', { frameCount: CLIP_FRAMES, seed: 23 });
    // A track to mark on (the workspace makes the first track the active one).
    const track = await page.request.post(`${url}/api/teams/${teamId}/clips/${clipId}/tracks`, { headers: HEADERS, data: { name: 'Bench ball' } });
    if (!track.ok()) throw new Error(`could not start a track: ${track.status()} ${await track.text()}`);
    await page.goto(`${url}/t/${teamId}/clips/${clipId}/workspace`);
    await waitShown(page, 0);
    await page.locator('[data-testid="frame-stage"]').focus();

    // Warm the cache: walk every frame once, waiting until each is on screen.
    for (let n = 1; n < CLIP_FRAMES; n++) {
      await page.keyboard.press('ArrowRight');
      await waitShown(page, n);
    }
    await page.keyboard.press('Home'); // no marks yet: stays; go back explicitly
    for (let n = CLIP_FRAMES - 2; n >= 0; n--) {
      await page.keyboard.press('ArrowLeft');
      await waitShown(page, n);
    }

    // Measured steps: back and forth inside the clip, every frame decoded.
    await page.evaluate(() => {
      window.__arcbenchFrameTimings = { pendingKeyAt: null, samples: [] };
    });
    let frame = Number(await shownFrame(page));
    let direction = 1;
    for (let i = 0; i < STEPS; i++) {
      if (frame + direction < 0 || frame + direction >= CLIP_FRAMES) direction = -direction;
      frame += direction;
      await page.keyboard.press(direction > 0 ? 'ArrowRight' : 'ArrowLeft');
      await page.waitForFunction((count) => (window.__arcbenchFrameTimings?.samples.length ?? 0) >= count, i + 1);
    }
    const samples = await page.evaluate(() => window.__arcbenchFrameTimings!.samples);
    const missed = samples.filter((s, i) => i > 0 && s.frameNumber === samples[i - 1].frameNumber).length;

    // Baseline: a key the workspace ignores, keydown to the next animation frame.
    // Baseline through the same input path: a key the workspace ignores ("q"),
    // keydown to the next animation frame. Passed as text: tsx would wrap
    // named functions in a helper the page does not have.
    await page.evaluate(`(() => {
      window.__arcbenchBaseline = [];
      window.addEventListener('keydown', (e) => {
        if (e.key === 'q') requestAnimationFrame(() => window.__arcbenchBaseline.push(performance.now() - e.timeStamp));
      });
    })()`);
    for (let i = 0; i < STEPS; i++) {
      await page.keyboard.press('q');
      await page.waitForFunction((n) => ((window as unknown as { __arcbenchBaseline: number[] }).__arcbenchBaseline.length >= n), i + 1);
    }
    const baseline = (await page.evaluate('window.__arcbenchBaseline')) as number[];

    const clicks = await benchMarkClicks(page);

    const drawn = samples.map((s) => s.drawnAt - s.keyAt);
    const painted = samples.map((s) => s.paintedAt - s.keyAt);
    const f = (v: number) => v.toFixed(2).padStart(7);
    const p95 = quantile(drawn, 0.95);
    const lines = [
      `frame step over ${samples.length} steps on decoded frames (headless chromium, ${CLIP_FRAMES}-frame 640x360 clip)`,
      `  keydown → new frame drawn        p50 ${f(quantile(drawn, 0.5))} ms   p95 ${f(p95)} ms   (target p95 ≤ ${TARGET_P95_MS} ms: ${p95 <= TARGET_P95_MS ? 'met' : 'MISSED'})`,
      `  keydown → next animation frame   p50 ${f(quantile(painted, 0.5))} ms   p95 ${f(quantile(painted, 0.95))} ms`,
      `  baseline: keydown → animation frame, nothing changed   p50 ${f(quantile(baseline, 0.5))} ms   p95 ${f(quantile(baseline, 0.95))} ms`,
      `  ratio (step to paint / baseline, p50): ${(quantile(painted, 0.5) / quantile(baseline, 0.5)).toFixed(2)}`,
    ];
    if (missed) lines.push(`  note: ${missed} samples repeated a frame number`);
    lines.push(...clicks);
    await context.close();
    return lines.join('\n');
  } finally {
    await browser.close();
    await server?.stop();
  }
}

/** Marking clicks from frame 0 on, each placing a mark and stepping, with every save held in flight. */
async function benchMarkClicks(page: Page): Promise<string[]> {
  for (let n = Number(await shownFrame(page)); n > 0; n--) {
    await page.keyboard.press('ArrowLeft');
    await waitShown(page, n - 1);
  }
  await page.keyboard.press('p'); // the place tool
  let inFlight = 0;
  let heldWhileClicked = 0;
  await page.route('**/api/teams/*/tracks/*/marks/*', async (route) => {
    inFlight++;
    await new Promise((r) => setTimeout(r, SAVE_HELD_MS));
    inFlight--;
    // A save the page gave up on meanwhile is already settled: nothing to pass on.
    await route.continue().catch(() => undefined);
  });
  const box = await page.locator('[data-testid="frame-stage"] canvas').first().boundingBox();
  if (!box) throw new Error('the frame stage has no canvas');
  await page.evaluate(() => {
    window.__arcbenchFrameTimings = { pendingKeyAt: null, samples: [] };
  });
  for (let i = 0; i < CLICKS; i++) {
    if (inFlight > 0) heldWhileClicked++;
    // A different spot each time, away from the edges, as a person following a ball would click.
    await page.mouse.click(box.x + box.width * (0.3 + 0.4 * (i / CLICKS)), box.y + box.height * (0.4 + 0.1 * Math.sin(i)));
    await page.waitForFunction((count) => (window.__arcbenchFrameTimings?.samples.length ?? 0) >= count, i + 1);
    await page.evaluate(() => new Promise((done) => requestIdleCallback(() => done(null), { timeout: 1000 })));
  }
  const samples = await page.evaluate(() => window.__arcbenchFrameTimings!.samples);
  while (inFlight > 0) await new Promise((r) => setTimeout(r, 50));
  await page.unroute('**/api/teams/*/tracks/*/marks/*');

  await page.evaluate(`(() => {
    window.__arcbenchClickBaseline = [];
    window.addEventListener('mousedown', (e) => {
      if (e.target === document.body || e.target.tagName === 'H1') requestAnimationFrame(() => window.__arcbenchClickBaseline.push(performance.now() - e.timeStamp));
    }, true);
  })()`);
  const heading = await page.locator('h1').first().boundingBox();
  if (!heading) throw new Error('the workspace has no heading to click for the baseline');
  for (let i = 0; i < CLICKS; i++) {
    await page.mouse.click(heading.x + 2, heading.y + heading.height / 2);
    await page.waitForFunction((n) => (window as unknown as { __arcbenchClickBaseline: number[] }).__arcbenchClickBaseline.length >= n, i + 1);
  }
  const baseline = (await page.evaluate('window.__arcbenchClickBaseline')) as number[];

  const drawn = samples.map((s) => s.drawnAt - s.keyAt);
  const painted = samples.map((s) => s.paintedAt - s.keyAt);
  const f = (v: number) => v.toFixed(2).padStart(7);
  const p95 = quantile(drawn, 0.95);
  return [
    `mark click over ${samples.length} clicks (place tool; each save held ${SAVE_HELD_MS} ms, one in flight at ${heldWhileClicked} of ${CLICKS} clicks)`,
    `  mousedown → next frame drawn     p50 ${f(quantile(drawn, 0.5))} ms   p95 ${f(p95)} ms   (target p95 ≤ ${TARGET_P95_MS} ms: ${p95 <= TARGET_P95_MS ? 'met' : 'MISSED'})`,
    `  mousedown → next animation frame p50 ${f(quantile(painted, 0.5))} ms   p95 ${f(quantile(painted, 0.95))} ms`,
    `  baseline: mousedown → animation frame, nothing changed   p50 ${f(quantile(baseline, 0.5))} ms   p95 ${f(quantile(baseline, 0.95))} ms`,
    `  ratio (click to paint / baseline, p50): ${(quantile(painted, 0.5) / quantile(baseline, 0.5)).toFixed(2)}`,
  ];
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  benchWorkspace(process.argv[2]).then(
    (report) => console.log(report),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
