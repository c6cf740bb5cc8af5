import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { AutoMarkBody, AutoMarkRun, AutoMarkRunList, AutoMarkRunParams, AutoMarkSettings, AutoMarkStarted, AutoMarkTrackParams } from '../../shared/schemas/auto-mark';
import { TeamParams } from '../../shared/schemas/common';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { cancelRun, getRun, listTrackRuns, startAutoMark } from '../automark/runs';
import { getAutoMarkSettings, setAutoMarkSettings } from '../automark/settings';
import { currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

/**
 * Automatic marking: a job follows the projectile through a track's clip and
 * writes marks as it decides them (source 'auto', with a confidence); the
 * run is polled for progress and can be cancelled. The team's review
 * threshold decides which automatic marks are flagged and left out of fits.
 */
export function autoMarkRoutes(api: RouteTable, deps: AppDeps) {
  const { db } = deps;
  const runs = '/api/teams/:teamId/auto-mark-runs/:runId';
  api.post('/api/teams/:teamId/tracks/:trackId/auto-mark', { summary: 'Start marking a track automatically', status: 202, response: AutoMarkStarted }, signedIn, teamRole(CAN.mark), validate({ params: AutoMarkTrackParams, body: AutoMarkBody }), start);
  api.get('/api/teams/:teamId/tracks/:trackId/auto-mark-runs', { summary: 'Auto-mark runs of a track, newest first', response: AutoMarkRunList }, signedIn, teamRole(CAN.read), validate({ params: AutoMarkTrackParams }), listForTrack);
  api.get(runs, { summary: 'One auto-mark run: state, progress, counts, launch frame, why it ended', response: AutoMarkRun }, signedIn, teamRole(CAN.read), validate({ params: AutoMarkRunParams }), getOne);
  api.post(`${runs}/cancel`, { summary: 'Cancel a queued or running auto-mark run', response: AutoMarkRun }, signedIn, teamRole(CAN.mark), validate({ params: AutoMarkRunParams }), cancel);
  api.get('/api/teams/:teamId/auto-mark-settings', { summary: 'The team’s review threshold for automatic marks', response: AutoMarkSettings }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), getSettings);
  api.put('/api/teams/:teamId/auto-mark-settings', { summary: 'Set the team’s review threshold for automatic marks', response: AutoMarkSettings }, signedIn, teamRole(CAN.runFits), validate({ params: TeamParams, body: AutoMarkSettings }), putSettings);

  const actor = (res: Response) => ({ teamId: currentTeam(res).id, userId: currentUser(res).id });

  async function start(_req: Request, res: Response) {
    const { params, body } = input(res, { params: AutoMarkTrackParams, body: AutoMarkBody });
    res.status(202).json(await startAutoMark(db, deps.jobs, actor(res), params.trackId, body));
  }

  async function listForTrack(_req: Request, res: Response) {
    const { params } = input(res, { params: AutoMarkTrackParams });
    res.json({ runs: await listTrackRuns(db, currentTeam(res).id, params.trackId) });
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: AutoMarkRunParams });
    res.json(await getRun(db, currentTeam(res).id, params.runId));
  }

  async function cancel(_req: Request, res: Response) {
    const { params } = input(res, { params: AutoMarkRunParams });
    res.json(await cancelRun(db, deps.jobs, actor(res), params.runId));
  }

  async function getSettings(_req: Request, res: Response) {
    res.json(await getAutoMarkSettings(db, currentTeam(res).id));
  }

  async function putSettings(_req: Request, res: Response) {
    const { body } = input(res, { params: TeamParams, body: AutoMarkSettings });
    res.json(await setAutoMarkSettings(db, actor(res), body));
  }
}
