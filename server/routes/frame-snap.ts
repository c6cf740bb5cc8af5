import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { ClipFrameParams, SnapBody, SnapResult } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { snapOnStoredFrame } from '../marking/frame-snap';

/** The sub-pixel snap on the stored frame image; serves the editor, tests and scripts. */
export function frameSnapRoutes(api: RouteTable, { db, storage }: AppDeps) {
  api.post(
    '/api/teams/:teamId/clips/:clipId/frames/:frameNumber/snap',
    { summary: 'Refine a click to the projectile’s centroid on the stored frame', response: SnapResult },
    signedIn,
    teamRole(CAN.mark),
    validate({ params: ClipFrameParams, body: SnapBody }),
    snap,
  );

  async function snap(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipFrameParams, body: SnapBody });
    res.json(await snapOnStoredFrame(db, storage, currentTeam(res).id, { ...params, ...body }));
  }
}
