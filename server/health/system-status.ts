// What /api/health reports. Cheap on purpose: anyone may call it, often
// (load balancers, uptime checks), so it never starts a process per request.
// ffmpeg is probed once at start and again at most once a minute, in the
// background; the database answers a trivial query. The deeper check
// (versions, latency, storage) is for admins.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type pg from 'pg';
import type { HealthStatus } from '../../shared/schemas/system-responses';
import { ffmpegBinary } from '../config';

const run = promisify(execFile);

export const FFMPEG_PROBE_INTERVAL_MS = 60_000;

interface FfmpegState {
  ok: boolean;
  version?: string;
  error?: string;
  checkedAt: number;
}

let ffmpegState: FfmpegState | null = null;
let probing: Promise<FfmpegState> | null = null;
let probeCount = 0;

function probeFfmpeg(): Promise<FfmpegState> {
  if (probing) return probing;
  probeCount += 1;
  probing = run(ffmpegBinary(), ['-hide_banner', '-version'], { timeout: 10_000 })
    .then(({ stdout }) => ({ ok: true, version: stdout.split('\n')[0], checkedAt: Date.now() }))
    .catch(() => ({ ok: false, error: 'ffmpeg not found on PATH', checkedAt: Date.now() }))
    .then((state) => {
      ffmpegState = state;
      probing = null;
      return state;
    });
  return probing;
}

/** Probes ffmpeg now (server start); later calls reuse the answer for a minute. */
export function primeFfmpegProbe(): Promise<void> {
  return probeFfmpeg().then(() => undefined);
}

/** ffmpeg's last known state; refreshed in the background when older than a minute. */
async function ffmpegStatus(): Promise<FfmpegState> {
  if (!ffmpegState) return probeFfmpeg();
  if (Date.now() - ffmpegState.checkedAt >= FFMPEG_PROBE_INTERVAL_MS) void probeFfmpeg();
  return ffmpegState;
}

/** How many times ffmpeg was started by the health check (tests count it). */
export function ffmpegProbeCount(): number {
  return probeCount;
}

export interface SystemStatus {
  ok: boolean;
  body: HealthStatus;
}

/** Whether the database answers and ffmpeg was found (at the last probe). Cheap enough to call for anyone. */
export async function systemStatus(pool: pg.Pool): Promise<SystemStatus> {
  const database = await pool
    .query('select 1')
    .then(() => ({ ok: true }))
    .catch(() => ({ ok: false, error: 'the database does not answer' }));
  const ff = await ffmpegStatus();
  const ffmpeg = ff.ok ? { ok: true } : { ok: false, error: ff.error };
  const ok = database.ok && ff.ok;
  return { ok, body: { status: ok ? 'ok' : 'degraded', database, ffmpeg } };
}

/** The admin's view: versions, database latency, when ffmpeg was last checked. */
export async function detailedSystemStatus(pool: pg.Pool): Promise<SystemStatus> {
  const started = performance.now();
  const database = await pool
    .query('select version() as version')
    .then((r) => ({ ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10, version: String(r.rows[0].version).split(' ').slice(0, 2).join(' ') }))
    .catch((err: Error) => ({ ok: false, error: err.message }));
  const ff = await ffmpegStatus();
  const ffmpeg = { ok: ff.ok, ...(ff.version ? { version: ff.version } : {}), ...(ff.error ? { error: ff.error } : {}), checkedAt: new Date(ff.checkedAt).toISOString() };
  const ok = database.ok && ff.ok;
  return { ok, body: { status: ok ? 'ok' : 'degraded', database, ffmpeg } };
}
