import type { AppDeps } from '../app-deps';
import { sendDailyDigests } from './send-digests';

const DAY_MS = 24 * 3600 * 1000;

/**
 * Sends the daily digests once a day from the server process (the first run a day
 * after start). Several server processes may each run it: send-digests claims rows
 * with SKIP LOCKED, so nobody gets an event twice.
 */
export function startDigestTimer(deps: Pick<AppDeps, 'db' | 'mailer'>, everyMs = DAY_MS): () => void {
  const timer = setInterval(() => {
    sendDailyDigests(deps).catch((err) => console.error('[notifications] digest run failed:', (err as Error).message));
  }, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
