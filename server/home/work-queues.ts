// What waits for each role of a team: one query per queue, each returning the
// count and the oldest few items, so the team home shows "yours to do" first.
import { and, asc, eq, gt, inArray, isNotNull, isNull, lt, sql, type SQL } from 'drizzle-orm';
import type { Role } from '../../shared/roles';
import type { WorkItem, WorkQueue, WorkQueueKey, WorkQueues } from '../../shared/schemas/work-queues';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { invitations } from '../db/schema/invitations';
import { calibrations, marks, tracks } from '../db/schema/marking';
import { shots } from '../db/schema/records';
import { teams } from '../db/schema/teams';
import { refreshStaleness } from '../fits/staleness';
import { recentActivity } from './activity';
import { presetTrends } from './preset-trends';

const ITEMS_PER_QUEUE = 5;

interface Row {
  id: string;
  label: string;
  detail: string | null;
  href: string;
  at: Date;
}

const toItems = (rows: Row[]): WorkItem[] => rows.slice(0, ITEMS_PER_QUEUE).map((r) => ({ ...r, at: r.at.toISOString() }));

function queue(key: WorkQueueKey, role: Role, title: string, rows: Row[]): WorkQueue {
  return { key, role, title, count: rows.length, items: toItems(rows) };
}

const workspace = (teamId: string, clipId: string) => `/t/${teamId}/clips/${clipId}/workspace`;
const hasCalibration = (clipId: SQL | typeof clips.id) => sql`exists (select 1 from ${calibrations} where ${calibrations.clipId} = ${clipId})`;

async function clipsToCalibrate(db: Db, teamId: string): Promise<Row[]> {
  const rows = await db
    .select({ id: clips.id, shot: shots.label, name: clips.originalName, at: clips.createdAt })
    .from(clips)
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .where(and(eq(clips.teamId, teamId), eq(clips.status, 'ready'), sql`not ${hasCalibration(clips.id)}`))
    .orderBy(asc(clips.createdAt));
  return rows.map((r) => ({ id: r.id, label: r.shot, detail: r.name, href: workspace(teamId, r.id), at: r.at }));
}

async function failedExtractions(db: Db, teamId: string): Promise<Row[]> {
  const rows = await db
    .select({ id: clips.id, shotId: clips.shotId, shot: shots.label, error: clips.error, at: clips.updatedAt })
    .from(clips)
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .where(and(eq(clips.teamId, teamId), eq(clips.status, 'failed')))
    .orderBy(asc(clips.updatedAt));
  return rows.map((r) => ({ id: r.id, label: r.shot, detail: r.error, href: `/t/${teamId}/shots/${r.shotId}`, at: r.at }));
}

async function clipsToMark(db: Db, teamId: string): Promise<Row[]> {
  const noMarks = sql`not exists (select 1 from ${marks} inner join ${tracks} on ${tracks.id} = ${marks.trackId} where ${tracks.clipId} = ${clips.id})`;
  const rows = await db
    .select({ id: clips.id, shot: shots.label, name: clips.originalName, at: clips.createdAt })
    .from(clips)
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .where(and(eq(clips.teamId, teamId), eq(clips.status, 'ready'), hasCalibration(clips.id), noMarks))
    .orderBy(asc(clips.createdAt));
  return rows.map((r) => ({ id: r.id, label: r.shot, detail: r.name, href: workspace(teamId, r.id), at: r.at }));
}

async function flaggedAutoMarks(db: Db, teamId: string): Promise<Row[]> {
  const [team] = await db.select({ threshold: teams.autoMarkReviewThreshold }).from(teams).where(eq(teams.id, teamId));
  const rows = await db
    .select({ id: tracks.id, clipId: tracks.clipId, name: tracks.name, shot: shots.label, flagged: sql<number>`count(*)::int`, at: sql<Date>`min(${marks.updatedAt})` })
    .from(marks)
    .innerJoin(tracks, eq(tracks.id, marks.trackId))
    .innerJoin(clips, eq(clips.id, tracks.clipId))
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .where(and(eq(tracks.teamId, teamId), eq(marks.source, 'auto'), isNotNull(marks.confidence), lt(marks.confidence, team.threshold)))
    .groupBy(tracks.id, tracks.clipId, tracks.name, shots.label)
    .orderBy(sql`min(${marks.updatedAt})`);
  return rows.map((r) => ({ id: r.id, label: `${r.shot} · ${r.name}`, detail: `${r.flagged} flagged ${r.flagged === 1 ? 'mark' : 'marks'}`, href: workspace(teamId, r.clipId), at: new Date(r.at) }));
}

/** Fits whose stored state says so, after the staleness check the fit pages also make. */
async function fitsInState(db: Db, teamId: string, state: 'awaiting-review' | 'stale'): Promise<Row[]> {
  const rows = await db
    .select({ id: fits.id, trackId: fits.trackId, clipId: fits.clipId, marksRevision: fits.marksRevision, calibrationVersion: fits.calibrationVersion, state: fits.state, shot: shots.label, at: fits.createdAt })
    .from(fits)
    .innerJoin(shots, eq(shots.id, fits.shotId))
    .where(and(eq(fits.teamId, teamId), inArray(fits.state, ['awaiting-review', 'stale'])))
    .orderBy(asc(fits.createdAt));
  await refreshStaleness(db, rows.filter((r) => r.state === 'awaiting-review'));
  // A stale fit is only work while no newer fit of its track exists.
  const newestOfTrack = new Map<string, string>();
  for (const r of rows) newestOfTrack.set(r.trackId, r.id);
  return rows
    .filter((r) => r.state === state && (state === 'awaiting-review' || newestOfTrack.get(r.trackId) === r.id))
    .map((r) => ({ id: r.id, label: r.shot, detail: state === 'stale' ? 'Inputs changed since it ran: run it again' : null, href: `/t/${teamId}/fits/${r.id}`, at: r.at }));
}

async function tracksReadyToFit(db: Db, teamId: string): Promise<Row[]> {
  const noFitSinceDone = sql`not exists (select 1 from ${fits} where ${fits.trackId} = ${tracks.id} and ${fits.createdAt} >= ${tracks.markingDoneAt})`;
  const rows = await db
    .select({ id: tracks.id, name: tracks.name, shotId: shots.id, shot: shots.label, at: tracks.markingDoneAt })
    .from(tracks)
    .innerJoin(clips, eq(clips.id, tracks.clipId))
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .where(and(eq(tracks.teamId, teamId), isNotNull(tracks.markingDoneAt), noFitSinceDone))
    .orderBy(asc(tracks.markingDoneAt));
  return rows.map((r) => ({ id: r.id, label: `${r.shot} · ${r.name}`, detail: 'Marking done, no fit yet', href: `/t/${teamId}/shots/${r.shotId}/fits`, at: r.at! }));
}

async function pendingInvitations(db: Db, teamId: string): Promise<Row[]> {
  const rows = await db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, at: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.createdAt));
  return rows.map((r) => ({ id: r.id, label: r.email, detail: `invited as ${r.role}`, href: `/t/${teamId}/members`, at: r.at }));
}

/** Every queue of the team (the page puts the viewer's own role first), recent activity and preset trends. */
export async function teamWorkQueues(db: Db, teamId: string): Promise<WorkQueues> {
  const queues = [
    queue('clips-to-calibrate', 'analyst', 'Clips to calibrate', await clipsToCalibrate(db, teamId)),
    queue('failed-extractions', 'analyst', 'Failed frame extractions', await failedExtractions(db, teamId)),
    queue('clips-to-mark', 'tracker', 'Calibrated clips with no marks', await clipsToMark(db, teamId)),
    queue('flagged-auto-marks', 'tracker', 'Tracks with flagged automatic marks', await flaggedAutoMarks(db, teamId)),
    queue('tracks-ready-to-fit', 'engineer', 'Marking done, no fit yet', await tracksReadyToFit(db, teamId)),
    queue('fits-awaiting-review', 'engineer', 'Fits awaiting review', await fitsInState(db, teamId, 'awaiting-review')),
    queue('stale-fits', 'engineer', 'Stale fits', await fitsInState(db, teamId, 'stale')),
    queue('pending-invitations', 'admin', 'Pending invitations', await pendingInvitations(db, teamId)),
  ];
  return { queues, activity: await recentActivity(db, teamId), trends: await presetTrends(db, teamId) };
}
