import type { Request, Response } from 'express';
import { z } from 'zod';
import { HealthStatus } from '../../shared/schemas/system-responses';
import type { AppDeps } from '../app-deps';
import { open } from '../auth/access';
import { isAdminOfAnyTeam } from '../health/admin-check';
import { detailedSystemStatus, systemStatus } from '../health/system-status';
import { input } from '../http/input';
import { forbidden } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

const HealthQuery = z.object({ detail: z.enum(['0', '1']).optional() });

export function healthRoutes(api: RouteTable, { pool, db }: AppDeps) {
  api.get('/api/health', { summary: 'Database and ffmpeg status (cheap; ?detail=1 adds versions and latency for team admins)', response: HealthStatus }, open, validate({ query: HealthQuery }), health);

  async function health(req: Request, res: Response) {
    const wantsDetail = input(res, { query: HealthQuery }).query.detail === '1';
    if (wantsDetail && !(await isAdminOfAnyTeam(db, req.session?.userId))) throw forbidden('The detailed health check is for team admins; sign in as one.');
    const { ok, body } = wantsDetail ? await detailedSystemStatus(pool) : await systemStatus(pool);
    res.status(ok ? 200 : 503).json(body);
  }
}
