import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type pg from 'pg';

const run = promisify(execFile);

export interface SystemStatus {
  ok: boolean;
  body: { status: 'ok' | 'degraded'; database: object; ffmpeg: object };
}

/** Whether the database answers and ffmpeg is on PATH, with their versions. */
export async function systemStatus(pool: pg.Pool): Promise<SystemStatus> {
  const started = performance.now();
  const database = await pool
    .query('select version() as version')
    .then((r) => ({ ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10, version: String(r.rows[0].version).split(' ').slice(0, 2).join(' ') }))
    .catch((err: Error) => ({ ok: false, error: err.message }));
  const ffmpeg = await run('ffmpeg', ['-hide_banner', '-version'])
    .then(({ stdout }) => ({ ok: true, version: stdout.split('\n')[0] }))
    .catch(() => ({ ok: false, error: 'ffmpeg not found on PATH' }));
  const ok = database.ok && ffmpeg.ok;
  return { ok, body: { status: ok ? 'ok' : 'degraded', database, ffmpeg } };
}
