import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { WorkQueues } from '../../shared/schemas/work-queues';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { currentTeam } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { teamWorkQueues } from '../home/work-queues';

/** The team home: what waits for each role, recent activity and the approved numbers per preset. */
export function workQueueRoutes(api: RouteTable, { db }: AppDeps) {
  api.get('/api/teams/:teamId/work-queues', { summary: 'Work queues per role, recent activity and preset trends for the team home', response: WorkQueues }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), show);

  async function show(_req: Request, res: Response) {
    res.json(await teamWorkQueues(db, currentTeam(res).id));
  }
}
