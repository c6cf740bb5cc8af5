// First load in headless chromium on loopback, each sample in a fresh browser
// context (empty HTTP cache, as a first visit):
//  - navigation start → the sign-in form visible;
//  - navigation start → the workspace canvas showing frame 0 (signed in, cold cache);
//  - baseline: navigation start → a static file from the same server loaded
//    (public/arcbench.svg), the floor that network, server and browser set.
// The moment something becomes visible is taken by a MutationObserver put in
// before any page script runs, so playwright's polling adds nothing.
// Run alone: npx tsx scripts/bench-first-load.ts (needs DATABASE_URL and a
// built client, as `npm run bench` provides).
import { pathToFileURL } from 'node:url';
import type { Browser, BrowserContextOptions } from 'playwright-core';
import { DEMO_PASSWORD, demoPerson } from '../server/seed/demo-people';
import { startAppServer } from '../tests/support/app-server';
import { launchBrowser, signIn } from '../tests/support/browser';
import { demoTeamId, uploadGeneratedClip } from '../tests/support/generated-clip-upload';

const SAMPLES = 9;

declare global {
  interface Window {
    __arcbenchVisibleAt?: number;
  }
}

/** Notes performance.now() the first time `selector` matches; runs before the page's own scripts. */
function watchFor(selector: string): string {
  return `(() => {
    const check = () => {
      if (window.__arcbenchVisibleAt === undefined && document.querySelector(${JSON.stringify(selector)})) {
        window.__arcbenchVisibleAt = performance.now();
        observer.disconnect();
      }
    };
    const observer = new MutationObserver(check);
    observer.observe(document, { childList: true, subtree: true, attributes: true });
  })()`;
}

async function timeToVisible(browser: Browser, url: string, selector: string, options: BrowserContextOptions = {}): Promise<number> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 }, ...options });
  try {
    await context.addInitScript(watchFor(selector));
    const page = await context.newPage();
    await page.goto(url);
    await page.waitForFunction(() => window.__arcbenchVisibleAt !== undefined, undefined, { timeout: 60_000 });
    return (await page.evaluate(() => window.__arcbenchVisibleAt)) as number;
  } finally {
    await context.close();
  }
}

async function timeToStaticFile(browser: Browser, url: string): Promise<number> {
  const context = await browser.newContext();
  try {
    const page = await context.newPage();
    await page.goto(url, { waitUntil: 'load' });
    return await page.evaluate(() => (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).loadEventEnd);
  } finally {
    await context.close();
  }
}

const median = (values: number[]) => {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

export async function benchFirstLoad(baseUrl?: string): Promise<string> {
  if (!baseUrl && !process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run through `npm run bench`, which starts a throwaway database.');
  const server = baseUrl ? null : await startAppServer();
  const url = baseUrl ?? server!.url;
  const browser = await launchBrowser();
  try {
    // A signed-in session and a small clip for the workspace samples.
    const setup = await browser.newContext();
    const page = await setup.newPage();
    await signIn(page, url, demoPerson('analyst').email, DEMO_PASSWORD);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const teamId = await demoTeamId(page.request, url);
    const { clipId } = await uploadGeneratedClip(page.request, url, teamId, 'clean', { frameCount: 12, seed: 31 });
    const storageState = await setup.storageState();
    await setup.close();

    const staticMs: number[] = [];
    const formMs: number[] = [];
    const workspaceMs: number[] = [];
    // Interleaved, so a busy moment on the machine touches all three alike.
    for (let i = 0; i < SAMPLES; i++) {
      staticMs.push(await timeToStaticFile(browser, `${url}/arcbench.svg`));
      formMs.push(await timeToVisible(browser, `${url}/sign-in`, 'form input[type="password"]'));
      workspaceMs.push(
        await timeToVisible(browser, `${url}/t/${teamId}/clips/${clipId}/workspace`, '[data-testid="frame-stage"][data-shown-frame="0"]', { storageState }),
      );
    }
    const base = median(staticMs);
    const f = (v: number) => v.toFixed(0).padStart(5);
    const row = (label: string, values: number[]) =>
      `  ${label.padEnd(34)} median ${f(median(values))} ms   (${(median(values) / base).toFixed(1)}× the static file)`;
    return [
      `first load, ${SAMPLES} cold-cache samples each (headless chromium on loopback)`,
      row('baseline: static file loaded', staticMs),
      row('sign-in form visible', formMs),
      row('workspace canvas showing frame 0', workspaceMs),
    ].join('\n');
  } finally {
    await browser.close();
    await server?.stop();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  benchFirstLoad(process.argv[2]).then(
    (report) => console.log(report),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
