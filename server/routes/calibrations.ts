import type { Request, Response } from 'express';
import { desc, eq } from 'drizzle-orm';
import { buildCalibrationTransform } from '../../shared/geometry/calibration-transform';
import { GeometryError } from '../../shared/geometry/points';
import { CAN } from '../../shared/roles';
import { CalibrationCreateBody, ClipParams } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { clips } from '../db/schema/clips';
import { calibrations } from '../db/schema/marking';
import { currentTeam, currentUser, input } from '../http/input';
import { badRequest } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { calibrationValues, listCalibrationViews } from '../marking/calibration-records';
import { loadClip } from '../marking/scope';

/**
 * Calibration versions of a clip: scale reference, origin, level and optional
 * plane correction. Never edited in place: each change is a new version, so a
 * fit can always say which calibration its metres came from.
 */
export function calibrationRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/clips/:clipId/calibrations';
  api.get(base, 'All calibration versions of a clip, newest first', signedIn, teamRole(CAN.read), validate({ params: ClipParams }), list);
  api.get(`${base}/current`, 'The clip’s current calibration (null when uncalibrated)', signedIn, teamRole(CAN.read), validate({ params: ClipParams }), current);
  api.post(base, { summary: 'Calibrate the clip: stores a new version', status: 201 }, signedIn, teamRole(CAN.calibrate), validate({ params: ClipParams, body: CalibrationCreateBody }), create);

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    const clip = await loadClip(db, currentTeam(res).id, params.clipId);
    res.json({ calibrations: await listCalibrationViews(db, clip.id) });
  }

  async function current(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    const clip = await loadClip(db, currentTeam(res).id, params.clipId);
    const [latest] = await listCalibrationViews(db, clip.id, 1);
    res.json({ calibration: latest ?? null });
  }

  async function create(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipParams, body: CalibrationCreateBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const clip = await loadClip(db, team.id, params.clipId);
    let transform;
    try {
      transform = buildCalibrationTransform(body);
    } catch (err) {
      if (err instanceof GeometryError) throw badRequest(err.message, { errors: [{ path: `body.${err.field}`, message: err.message }] });
      throw err;
    }
    const id = await db.transaction(async (tx) => {
      // Locking the clip row serialises version numbers per clip.
      await tx.select({ id: clips.id }).from(clips).where(eq(clips.id, clip.id)).for('update');
      const [last] = await tx.select({ version: calibrations.version }).from(calibrations).where(eq(calibrations.clipId, clip.id)).orderBy(desc(calibrations.version)).limit(1);
      const version = (last?.version ?? 0) + 1;
      const [row] = await tx
        .insert(calibrations)
        .values({ clipId: clip.id, version, ...calibrationValues(body, transform), createdBy: user.id })
        .returning({ id: calibrations.id });
      await audit(tx, {
        teamId: team.id,
        actorUserId: user.id,
        action: 'calibration.create',
        targetType: 'clip',
        targetId: clip.id,
        detail: { calibrationId: row.id, version, pixelsPerMetre: transform.pixelsPerMetre, planeCorrection: body.plane !== null },
      });
      return row.id;
    });
    const views = await listCalibrationViews(db, clip.id);
    res.status(201).json(views.find((v) => v.id === id));
  }
}
