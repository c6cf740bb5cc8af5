import type { Request, Response } from 'express';
import type { AppDeps } from '../app-deps';
import { open } from '../auth/access';
import { systemStatus } from '../health/system-status';
import type { RouteTable } from '../http/route-table';

export function healthRoutes(api: RouteTable, { pool }: AppDeps) {
  api.get('/api/health', 'Database and ffmpeg status', open, health);

  async function health(_req: Request, res: Response) {
    const { ok, body } = await systemStatus(pool);
    res.status(ok ? 200 : 503).json(body);
  }
}
