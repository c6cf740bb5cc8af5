import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { FitParams, FitReviewBody, ShotFitsParams, ShotOverviewQuery, TrackFitParams } from '../../shared/schemas/fits';
import { FitDetailResponse, ReproduceReportResponse, ShotFitsResponse, ShotOverviewPageResponse } from '../../shared/schemas/fit-responses';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { fitMarksCsv } from '../fits/export-csv';
import { reproduceStoredFit, reviewFit, runTrackFit, shotFits, type FitActor } from '../fits/fit-service';
import { loadFitDetail } from '../fits/fit-view';
import { buildFitReportPdf } from '../fits/report-pdf';
import { shotOverview } from '../fits/shot-overview';
import { actorOf, currentTeam, currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { FIT_REVIEW_EXAMPLE, FIT_RUN_EXAMPLE } from '../http/api-examples';

/**
 * Fits: run on the server from a track's marks, stored with a snapshot of
 * every input, reviewed by an engineer, exported. The shot overview lives here
 * too because its status and numbers are the latest fit's.
 */
export function fitRoutes(api: RouteTable, deps: AppDeps) {
  const { db } = deps;
  const fit = '/api/teams/:teamId/fits/:fitId';
  api.post('/api/teams/:teamId/tracks/:trackId/fits', { summary: 'Run the drag and drag-free fits of a track and store them with their inputs', status: 201, response: FitDetailResponse, example: FIT_RUN_EXAMPLE }, signedIn, teamRole(CAN.runFits), validate({ params: TrackFitParams }), runFit);
  api.get('/api/teams/:teamId/shots/:shotId/fits', { summary: 'A shot’s fits, newest first, with its tracks', response: ShotFitsResponse }, signedIn, teamRole(CAN.read), validate({ params: ShotFitsParams }), shotFitList);
  api.get('/api/teams/:teamId/shot-overview', { summary: 'Team-wide shots with their latest fit: filtered, sorted and paged on the server', response: ShotOverviewPageResponse }, signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: ShotOverviewQuery }), overview);
  api.get(fit, { summary: 'One fit: result, input snapshot, state, staleness, review and audit trail', response: FitDetailResponse }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), getFit);
  api.post(`${fit}/reproduce`, { summary: 'Recompute a fit from its stored snapshot and say whether the numbers are identical', response: ReproduceReportResponse }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), reproduce);
  api.post(`${fit}/review`, { summary: 'Approve or reject a fit awaiting review (approved fits are frozen)', response: FitDetailResponse, example: FIT_REVIEW_EXAMPLE }, signedIn, teamRole(CAN.review), validate({ params: FitParams, body: FitReviewBody }), review);
  api.get(`${fit}/export.csv`, { summary: 'Marks with fitted positions and residuals', produces: 'text/csv' }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), exportCsv);
  api.get(`${fit}/export.json`, { summary: 'The whole fit as JSON (result and input snapshot)', produces: 'application/json', response: FitDetailResponse }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), exportJson);
  api.get(`${fit}/report.pdf`, { summary: 'Fit report with numbers, intervals, plots, inputs and safety caution', produces: 'application/pdf' }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), reportPdf);

  /** The acting user in the team of the path, with the names fit mails and reports show. */
  function fitActor(res: Response): FitActor {
    return { ...actorOf(res), teamName: currentTeam(res).name, displayName: currentUser(res).displayName };
  }

  async function runFit(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackFitParams });
    const detail = await runTrackFit(deps, fitActor(res), params.trackId);
    res.status(201).location(`/api/teams/${currentTeam(res).id}/fits/${detail.id}`).json(detail);
  }

  async function shotFitList(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotFitsParams });
    res.json(await shotFits(db, currentTeam(res).id, params.shotId));
  }

  async function overview(_req: Request, res: Response) {
    const { query } = input(res, { params: TeamParams, query: ShotOverviewQuery });
    res.json(await shotOverview(db, currentTeam(res).id, query));
  }

  async function getFit(_req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    res.json(await loadFitDetail(db, currentTeam(res).id, params.fitId));
  }

  async function reproduce(_req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    res.json(await reproduceStoredFit(db, currentTeam(res).id, params.fitId));
  }

  async function review(_req: Request, res: Response) {
    const { params, body } = input(res, { params: FitParams, body: FitReviewBody });
    res.json(await reviewFit(deps, fitActor(res), params.fitId, body));
  }

  async function exportCsv(_req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    const detail = await loadFitDetail(db, currentTeam(res).id, params.fitId);
    res.type('text/csv').attachment(`fit-${detail.id}.csv`).send(fitMarksCsv(detail));
  }

  async function exportJson(_req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    const detail = await loadFitDetail(db, currentTeam(res).id, params.fitId);
    res.type('application/json').attachment(`fit-${detail.id}.json`).send(JSON.stringify(detail, null, 2));
  }

  async function reportPdf(req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    const team = currentTeam(res);
    const detail = await loadFitDetail(db, team.id, params.fitId);
    // Dates in the reader's own locale, as the pages show them.
    const pdf = await buildFitReportPdf(detail, team.name, req.acceptsLanguages()[0]);
    res.type('application/pdf').attachment(`fit-report-${detail.id}.pdf`).send(pdf);
  }
}
