import type { Request, Response } from 'express';
import { and, asc, count, eq } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { FitParams, FitReviewBody, ShotFitsParams, ShotOverviewQuery, TrackFitParams, type ReproduceReport, type ShotFits } from '../../shared/schemas/fits';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { marks, tracks } from '../db/schema/marking';
import { shots, testSeries } from '../db/schema/records';
import { buildFitSnapshot } from '../fits/build-fit-input';
import { fitMarksCsv } from '../fits/export-csv';
import { listShotFits, loadFitDetail } from '../fits/fit-view';
import { notifyAwaitingReview, notifyReviewed, type FitMailContext } from '../fits/notify';
import { buildFitReportPdf } from '../fits/report-pdf';
import { computeFit, reproduceFit, storeFit } from '../fits/run-fit';
import { shotOverview } from '../fits/shot-overview';
import { refreshStaleness } from '../fits/staleness';
import { currentTeam, currentUser, input } from '../http/input';
import { conflict, notFound } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

/**
 * Fits: run on the server from a track's marks, stored with a snapshot of
 * every input, reviewed by an engineer, exported. The shot overview lives here
 * too because its status and numbers are the latest fit's.
 */
export function fitRoutes(api: RouteTable, deps: AppDeps) {
  const { db } = deps;
  const fit = '/api/teams/:teamId/fits/:fitId';
  api.post('/api/teams/:teamId/tracks/:trackId/fits', { summary: 'Run the drag and drag-free fits of a track and store them with their inputs', status: 201 }, signedIn, teamRole(CAN.runFits), validate({ params: TrackFitParams }), runFit);
  api.get('/api/teams/:teamId/shots/:shotId/fits', 'A shot’s fits, newest first, with its tracks', signedIn, teamRole(CAN.read), validate({ params: ShotFitsParams }), shotFits);
  api.get('/api/teams/:teamId/shot-overview', 'Team-wide shots with their latest fit: filtered, sorted and paged on the server', signedIn, teamRole(CAN.read), validate({ params: TeamParams, query: ShotOverviewQuery }), overview);
  api.get(fit, 'One fit: result, input snapshot, state, staleness, review and audit trail', signedIn, teamRole(CAN.read), validate({ params: FitParams }), getFit);
  api.post(`${fit}/reproduce`, 'Recompute a fit from its stored snapshot and say whether the numbers are identical', signedIn, teamRole(CAN.read), validate({ params: FitParams }), reproduce);
  api.post(`${fit}/review`, 'Approve or reject a fit awaiting review (approved fits are frozen)', signedIn, teamRole(CAN.review), validate({ params: FitParams, body: FitReviewBody }), review);
  api.get(`${fit}/export.csv`, { summary: 'Marks with fitted positions and residuals', produces: 'text/csv' }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), exportCsv);
  api.get(`${fit}/export.json`, { summary: 'The whole fit as JSON (result and input snapshot)', produces: 'application/json' }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), exportJson);
  api.get(`${fit}/report.pdf`, { summary: 'Fit report with numbers, intervals, plots, inputs and safety caution', produces: 'application/pdf' }, signedIn, teamRole(CAN.read), validate({ params: FitParams }), reportPdf);

  async function mailContext(teamId: string, teamName: string, fitId: string): Promise<FitMailContext> {
    const [row] = await db
      .select({ label: shots.label, speed: fits.launchSpeedMps, cd: fits.dragCoefficient })
      .from(fits)
      .innerJoin(shots, eq(shots.id, fits.shotId))
      .where(eq(fits.id, fitId));
    return { teamId, teamName, fitId, shotLabel: row.label, launchSpeedMps: row.speed, dragCoefficient: row.cd };
  }

  async function runFit(_req: Request, res: Response) {
    const { params } = input(res, { params: TrackFitParams });
    const team = currentTeam(res);
    const user = currentUser(res);
    const snapshot = await buildFitSnapshot(db, team.id, params.trackId);
    const result = computeFit(snapshot);
    const fitId = await storeFit(db, { teamId: team.id, userId: user.id, snapshot, result });
    await notifyAwaitingReview(deps, await mailContext(team.id, team.name, fitId), user.id);
    res.status(201).location(`/api/teams/${team.id}/fits/${fitId}`).json(await loadFitDetail(db, team.id, fitId));
  }

  async function shotFits(_req: Request, res: Response) {
    const { params } = input(res, { params: ShotFitsParams });
    const team = currentTeam(res);
    const [shot] = await db
      .select({ id: shots.id, label: shots.label, seriesName: testSeries.name })
      .from(shots)
      .leftJoin(testSeries, eq(testSeries.id, shots.seriesId))
      .where(and(eq(shots.id, params.shotId), eq(shots.teamId, team.id)));
    if (!shot) throw notFound('No such shot in this team.');
    const trackRows = await db
      .select({ id: tracks.id, name: tracks.name, kind: tracks.kind, clipId: tracks.clipId, markCount: count(marks.frameNumber) })
      .from(tracks)
      .innerJoin(clips, eq(clips.id, tracks.clipId))
      .leftJoin(marks, eq(marks.trackId, tracks.id))
      .where(and(eq(clips.shotId, shot.id), eq(tracks.teamId, team.id)))
      .groupBy(tracks.id, tracks.name, tracks.kind, tracks.clipId, tracks.createdAt)
      .orderBy(asc(tracks.createdAt));
    const body: ShotFits = {
      shot,
      tracks: trackRows.map((t) => ({ ...t, markCount: Number(t.markCount) })),
      fits: await listShotFits(db, team.id, shot.id),
    };
    res.json(body);
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
    const [row] = await db
      .select({ inputSnapshot: fits.inputSnapshot, result: fits.result, inputHash: fits.inputHash })
      .from(fits)
      .where(and(eq(fits.id, params.fitId), eq(fits.teamId, currentTeam(res).id)));
    if (!row) throw notFound('No such fit in this team.');
    const { identical, inputHashMatches, differences } = reproduceFit(row);
    const body: ReproduceReport = { identical, inputHashMatches, differences };
    res.json(body);
  }

  async function review(_req: Request, res: Response) {
    const { params, body } = input(res, { params: FitParams, body: FitReviewBody });
    const team = currentTeam(res);
    const user = currentUser(res);
    const runBy = await db.transaction(async (tx) => {
      // Row lock: two engineers pressing at once get one decision and one 409.
      const [row] = await tx
        .select({ id: fits.id, trackId: fits.trackId, clipId: fits.clipId, marksRevision: fits.marksRevision, calibrationVersion: fits.calibrationVersion, state: fits.state, createdBy: fits.createdBy })
        .from(fits)
        .where(and(eq(fits.id, params.fitId), eq(fits.teamId, team.id)))
        .for('update');
      if (!row) throw notFound('No such fit in this team.');
      if (row.state === 'awaiting-review') await refreshStaleness(tx as unknown as typeof db, [row]);
      if (row.state === 'approved') throw conflict('This fit is approved and frozen; it cannot be reviewed again. Run a new fit to revise it.', { state: row.state });
      if (row.state === 'rejected') throw conflict('This fit was already rejected. Run a new fit after fixing its inputs.', { state: row.state });
      if (row.state === 'stale') throw conflict('The marks or the calibration changed after this fit ran. Run the fit again and review the new one.', { state: row.state });
      const state = body.decision === 'approve' ? 'approved' : 'rejected';
      await tx.update(fits).set({ state, reviewedBy: user.id, reviewedAt: new Date(), reviewNote: body.note || null }).where(eq(fits.id, row.id));
      await audit(tx, { teamId: team.id, actorUserId: user.id, action: `fit.${state === 'approved' ? 'approve' : 'reject'}`, targetType: 'fit', targetId: row.id, detail: { note: body.note } });
      return row.createdBy;
    });
    await notifyReviewed(deps, await mailContext(team.id, team.name, params.fitId), body.decision, runBy, user, body.note);
    res.json(await loadFitDetail(db, team.id, params.fitId));
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

  async function reportPdf(_req: Request, res: Response) {
    const { params } = input(res, { params: FitParams });
    const team = currentTeam(res);
    const detail = await loadFitDetail(db, team.id, params.fitId);
    const pdf = await buildFitReportPdf(detail, team.name);
    res.type('application/pdf').attachment(`fit-report-${detail.id}.pdf`).send(pdf);
  }
}
