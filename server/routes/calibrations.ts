import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { Calibration, CalibrationCreateBody, CalibrationList, ClipParams, CurrentCalibration } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { CALIBRATE_EXAMPLE } from '../http/api-examples';
import { clipCalibrations, currentClipCalibration } from '../marking/calibrations';
import { calibrateAndHandOff } from '../marking/hand-offs';

/**
 * Calibration versions of a clip: scale reference, origin, level and optional
 * plane correction. Never edited in place: each change is a new version, so a
 * fit can always say which calibration its metres came from.
 */
export function calibrationRoutes(api: RouteTable, deps: AppDeps) {
  const { db } = deps;
  const base = '/api/teams/:teamId/clips/:clipId/calibrations';
  api.get(base, { summary: 'All calibration versions of a clip, newest first', response: CalibrationList }, signedIn, teamRole(CAN.read), validate({ params: ClipParams }), list);
  api.get(`${base}/current`, { summary: 'The clip’s current calibration (null when uncalibrated)', response: CurrentCalibration }, signedIn, teamRole(CAN.read), validate({ params: ClipParams }), current);
  api.post(base, { summary: 'Calibrate the clip: stores a new version', status: 201, response: Calibration, example: CALIBRATE_EXAMPLE }, signedIn, teamRole(CAN.calibrate), validate({ params: ClipParams, body: CalibrationCreateBody }), create);

  async function list(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    res.json({ calibrations: await clipCalibrations(db, currentTeam(res).id, params.clipId) });
  }

  async function current(_req: Request, res: Response) {
    const { params } = input(res, { params: ClipParams });
    res.json({ calibration: await currentClipCalibration(db, currentTeam(res).id, params.clipId) });
  }

  async function create(_req: Request, res: Response) {
    const { params, body } = input(res, { params: ClipParams, body: CalibrationCreateBody });
    res.status(201).json(await calibrateAndHandOff(deps, actorOf(res), params.clipId, body));
  }
}
