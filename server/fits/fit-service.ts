import { and, asc, count, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { FitDetail, FitReviewBody, ReproduceReport, ShotFits } from '../../shared/schemas/fits';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { marks, tracks } from '../db/schema/marking';
import { shots, testSeries } from '../db/schema/records';
import { forbidden, notFound } from '../http/problem';
import { OWN_FIT_APPROVAL_REASON } from '../../shared/schemas/team-settings';
import { teamSettings } from '../teams/team-settings';
import { buildFitSnapshot } from './build-fit-input';
import { listShotFits, loadFitDetail } from './fit-view';
import { notifyAwaitingReview, notifyReviewed, type FitMailContext } from './notify';
import { computeFit, reproduceFit, storeFit } from './run-fit';
import { reviewTransition } from './review-transition';
import { refreshStaleness } from './staleness';

// Fits: run on the server from a track's marks, stored with a snapshot of
// every input, reviewed by an engineer, exported.

type FitDeps = Pick<AppDeps, 'db' | 'mailer' | 'config'>;

/** The people side of a fit: who acts, in which team (its name goes into mails and reports). */
export interface FitActor extends Actor {
  teamName: string;
  displayName: string;
}

async function mailContext(db: Db, teamId: string, teamName: string, fitId: string): Promise<FitMailContext> {
  const [row] = await db
    .select({ label: shots.label, speed: fits.launchSpeedMps, cd: fits.dragCoefficient })
    .from(fits)
    .innerJoin(shots, eq(shots.id, fits.shotId))
    .where(eq(fits.id, fitId));
  return { teamId, teamName, fitId, shotLabel: row.label, launchSpeedMps: row.speed, dragCoefficient: row.cd };
}

/** Runs the drag and drag-free fits of a track, stores them with their inputs and tells the reviewers. */
export async function runTrackFit(deps: FitDeps, actor: FitActor, trackId: string): Promise<FitDetail> {
  const { db } = deps;
  const snapshot = await buildFitSnapshot(db, actor.teamId, trackId);
  const result = computeFit(snapshot);
  const fitId = await storeFit(db, { teamId: actor.teamId, userId: actor.userId, snapshot, result });
  await notifyAwaitingReview(deps, await mailContext(db, actor.teamId, actor.teamName, fitId), actor.userId);
  return loadFitDetail(db, actor.teamId, fitId);
}

/** A shot's fits, newest first, with its tracks and their mark counts. */
export async function shotFits(db: Db, teamId: string, shotId: string): Promise<ShotFits> {
  const [shot] = await db
    .select({ id: shots.id, label: shots.label, seriesName: testSeries.name })
    .from(shots)
    .leftJoin(testSeries, eq(testSeries.id, shots.seriesId))
    .where(and(eq(shots.id, shotId), eq(shots.teamId, teamId)));
  if (!shot) throw notFound('No such shot in this team.');
  const trackRows = await db
    .select({ id: tracks.id, name: tracks.name, kind: tracks.kind, clipId: tracks.clipId, markCount: count(marks.frameNumber) })
    .from(tracks)
    .innerJoin(clips, eq(clips.id, tracks.clipId))
    .leftJoin(marks, eq(marks.trackId, tracks.id))
    .where(and(eq(clips.shotId, shot.id), eq(tracks.teamId, teamId)))
    .groupBy(tracks.id, tracks.name, tracks.kind, tracks.clipId, tracks.createdAt)
    .orderBy(asc(tracks.createdAt));
  return {
    shot,
    tracks: trackRows.map((t) => ({ ...t, markCount: Number(t.markCount) })),
    fits: await listShotFits(db, teamId, shot.id),
  };
}

/** Recomputes a fit from its stored snapshot and says whether the numbers are identical. */
export async function reproduceStoredFit(db: Db, teamId: string, fitId: string): Promise<ReproduceReport> {
  const [row] = await db
    .select({ inputSnapshot: fits.inputSnapshot, result: fits.result, inputHash: fits.inputHash })
    .from(fits)
    .where(and(eq(fits.id, fitId), eq(fits.teamId, teamId)));
  if (!row) throw notFound('No such fit in this team.');
  const { identical, inputHashMatches, differences } = reproduceFit(row);
  return { identical, inputHashMatches, differences };
}

/** Approves or rejects a fit awaiting review (see reviewTransition), audits it and tells whoever ran it. */
export async function reviewFit(deps: FitDeps, actor: FitActor, fitId: string, body: z.output<typeof FitReviewBody>): Promise<FitDetail> {
  const { db } = deps;
  const runBy = await db.transaction(async (tx) => {
    // Row lock: two engineers pressing at once get one decision and one 409.
    const [row] = await tx
      .select({ id: fits.id, trackId: fits.trackId, clipId: fits.clipId, marksRevision: fits.marksRevision, calibrationVersion: fits.calibrationVersion, state: fits.state, createdBy: fits.createdBy })
      .from(fits)
      .where(and(eq(fits.id, fitId), eq(fits.teamId, actor.teamId)))
      .for('update');
    if (!row) throw notFound('No such fit in this team.');
    if (row.state === 'awaiting-review') await refreshStaleness(tx, [row]);
    const state = reviewTransition(row.state, body.decision);
    // Separation of duties: checked after the state, so a frozen fit still answers 409.
    if (state === 'approved' && row.createdBy === actor.userId && (await teamSettings(tx, actor.teamId)).separateFitApproval) throw forbidden(OWN_FIT_APPROVAL_REASON);
    await tx.update(fits).set({ state, reviewedBy: actor.userId, reviewedAt: new Date(), reviewNote: body.note || null }).where(eq(fits.id, row.id));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: `fit.${state === 'approved' ? 'approve' : 'reject'}`, targetType: 'fit', targetId: row.id, detail: { note: body.note } });
    return row.createdBy;
  });
  const reviewer = { id: actor.userId, displayName: actor.displayName };
  await notifyReviewed(deps, await mailContext(db, actor.teamId, actor.teamName, fitId), body.decision, runBy, reviewer, body.note);
  return loadFitDetail(db, actor.teamId, fitId);
}
