// E-mail about fits. Who hears what: everyone who may review (CAN.review) when a
// fit awaits review; when it is approved, the person who ran it; when it is
// rejected, the person who ran it and the analyst and frame marker of its clip
// (uploader, calibrator, marker), with the reviewer's note. Each person's own
// choice (none, each event, daily digest) is applied by notifyPeople.
import { eq } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import type { AppDeps } from '../app-deps';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { calibrations, marks, tracks } from '../db/schema/marking';
import { membersInRoles, notifyPeople } from '../notifications/hand-off-mail';

export interface FitMailContext {
  teamId: string;
  teamName: string;
  fitId: string;
  shotLabel: string;
  launchSpeedMps: number;
  dragCoefficient: number | null;
}

export function fitLink(publicUrl: string, teamId: string, fitId: string): string {
  return `${publicUrl.replace(/\/$/, '')}/t/${teamId}/fits/${fitId}`;
}

function headline(ctx: FitMailContext): string {
  const cd = ctx.dragCoefficient === null ? 'not resolved' : ctx.dragCoefficient.toFixed(3);
  return `Launch speed ${ctx.launchSpeedMps.toFixed(2)} m/s, drag coefficient ${cd}.`;
}

export async function notifyAwaitingReview(deps: Pick<AppDeps, 'db' | 'mailer' | 'config'>, ctx: FitMailContext, runByUserId: string) {
  const reviewers = await membersInRoles(deps.db, ctx.teamId, CAN.review, runByUserId);
  const text = [
    `A fit of shot "${ctx.shotLabel}" in ${ctx.teamName} is waiting for your review.`,
    '',
    headline(ctx),
    '',
    `Open it: ${fitLink(deps.config.publicUrl, ctx.teamId, ctx.fitId)}`,
    '',
    'You get this because you can review fits.',
  ].join('\n');
  await notifyPeople(deps, reviewers, { teamId: ctx.teamId, kind: 'fit-awaiting-review', subject: `Fit awaiting review: ${ctx.shotLabel}`, text });
}

/** Who prepared the fit's clip: its uploader, its calibrator and whoever marked the track. */
async function clipPeople(db: AppDeps['db'], fitId: string): Promise<string[]> {
  const [fit] = await db.select({ clipId: fits.clipId, trackId: fits.trackId, calibrationId: fits.calibrationId }).from(fits).where(eq(fits.id, fitId));
  if (!fit) return [];
  const ids: (string | null)[] = [];
  ids.push(...(await db.select({ id: clips.createdBy }).from(clips).where(eq(clips.id, fit.clipId))).map((r) => r.id));
  ids.push(...(await db.select({ id: calibrations.createdBy }).from(calibrations).where(eq(calibrations.id, fit.calibrationId))).map((r) => r.id));
  ids.push(...(await db.select({ id: tracks.markingDoneBy }).from(tracks).where(eq(tracks.id, fit.trackId))).map((r) => r.id));
  ids.push(...(await db.selectDistinct({ id: marks.updatedBy }).from(marks).where(eq(marks.trackId, fit.trackId))).map((r) => r.id));
  return ids.filter((id): id is string => !!id);
}

export async function notifyReviewed(
  deps: Pick<AppDeps, 'db' | 'mailer' | 'config'>,
  ctx: FitMailContext,
  decision: 'approve' | 'reject',
  runByUserId: string | null,
  reviewer: { id: string; displayName: string },
  note: string,
) {
  const word = decision === 'approve' ? 'approved' : 'rejected';
  const people = new Set<string>(runByUserId ? [runByUserId] : []);
  if (decision === 'reject') for (const id of await clipPeople(deps.db, ctx.fitId)) people.add(id);
  people.delete(reviewer.id);
  const text = [
    `${reviewer.displayName} ${word} the fit of shot "${ctx.shotLabel}" in ${ctx.teamName}.`,
    '',
    headline(ctx),
    note ? `\nReviewer's note: ${note}\n` : '',
    decision === 'reject' ? 'You get this because you ran the fit, or uploaded, calibrated or marked its clip.\n' : '',
    `Open it: ${fitLink(deps.config.publicUrl, ctx.teamId, ctx.fitId)}`,
  ].join('\n');
  await notifyPeople(deps, [...people], { teamId: ctx.teamId, kind: `fit-${word}`, subject: `Fit ${word}: ${ctx.shotLabel}`, text });
}
