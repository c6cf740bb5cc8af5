import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { Request, Response } from 'express';
import type { AppDeps } from '../app-deps';
import { open } from '../auth/access';
import type { RouteTable } from '../http/route-table';

const run = promisify(execFile);

export function healthRoutes(api: RouteTable, { pool }: AppDeps) {
  api.get('/api/health', 'Database and ffmpeg status', open, health);

  async function health(_req: Request, res: Response) {
    const started = performance.now();
    const database = await pool
      .query('select version() as version')
      .then((r) => ({ ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10, version: String(r.rows[0].version).split(' ').slice(0, 2).join(' ') }))
      .catch((err: Error) => ({ ok: false, error: err.message }));
    const ffmpeg = await run('ffmpeg', ['-hide_banner', '-version'])
      .then(({ stdout }) => ({ ok: true, version: stdout.split('\n')[0] }))
      .catch(() => ({ ok: false, error: 'ffmpeg not found on PATH' }));
    const ok = database.ok && ffmpeg.ok;
    res.status(ok ? 200 : 503).json({ status: ok ? 'ok' : 'degraded', database, ffmpeg });
  }
}
