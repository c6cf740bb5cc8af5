import type { Request, Response } from 'express';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { snapToCentroid } from '../../shared/marking/snap';
import { CAN } from '../../shared/roles';
import { ClipFrameParams, SnapBody, type SnapResult } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { clipFrames } from '../db/schema/clips';
import { currentTeam, input } from '../http/input';
import { notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { loadClip } from '../marking/scope';

/**
 * The sub-pixel snap run on the stored frame image. The client can run the
 * same shared function on canvas pixels; this route gives the same answer from
 * the exact stored frame (no canvas resampling), and serves tests and scripts.
 */
export function frameSnapRoutes(api: RouteTable, { db, storage }: AppDeps) {
  api.post(
    '/api/teams/:teamId/clips/:clipId/frames/:frameNumber/snap',
    'Refine a click to the projectile’s centroid on the stored frame',
    signedIn,
    teamRole(CAN.mark),
    validate({ params: ClipFrameParams, body: SnapBody }),
    snap,
  );

  async function snap(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipFrameParams, body: SnapBody });
    const clip = await loadClip(db, currentTeam(res).id, params.clipId);
    const [frame] = await db
      .select({ storageKey: clipFrames.storageKey })
      .from(clipFrames)
      .where(and(eq(clipFrames.clipId, clip.id), eq(clipFrames.frameNumber, params.frameNumber)));
    if (!frame) throw notFound(`Frame ${params.frameNumber} has not been extracted for this clip.`);
    const file = await storage.localPath(frame.storageKey);
    const { data, info } = await sharp(file).greyscale().raw().toBuffer({ resolveWithObject: true });
    const result = snapToCentroid({ width: info.width, height: info.height, channels: info.channels, data }, body.uPx, body.vPx, {
      windowPx: body.windowPx,
      dark: body.dark,
    });
    const out: SnapResult = { snapped: result ? { uPx: result.u, vPx: result.v, confidence: result.confidence } : null };
    res.json(out);
  }
}
