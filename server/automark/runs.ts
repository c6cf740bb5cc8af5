// Auto-mark runs as the API sees them: start (checks the clip, the seed and
// that no other run works on the track), read, list, cancel.
import { and, desc, eq, inArray } from 'drizzle-orm';
import type { z } from 'zod';
import type { AutoMarkBody, AutoMarkRun } from '../../shared/schemas/auto-mark';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { autoMarkRuns } from '../db/schema/auto-mark';
import { clips } from '../db/schema/clips';
import { tracks } from '../db/schema/marking';
import { HttpProblem, badRequest, conflict, notFound } from '../http/problem';
import type { Jobs } from '../jobs/queue';
import { loadTrack } from '../marking/scope';
import { endRun } from './auto-marks';
import { reviewThresholdOf } from './settings';

type RunRow = typeof autoMarkRuns.$inferSelect;
type StartBody = z.output<typeof AutoMarkBody>;

export interface Actor {
  teamId: string;
  userId: string;
}

/** The queue calls the service needs (server/jobs/queue.ts provides them). */
export type AutoMarkJobs = Pick<Jobs, 'enqueueAutoMark' | 'cancelAutoMark'>;

export function runView(row: RunRow): AutoMarkRun {
  return {
    id: row.id,
    trackId: row.trackId,
    clipId: row.clipId,
    state: row.state,
    progress: row.progress,
    framesMarked: row.framesMarked,
    framesFlagged: row.framesFlagged,
    launchFrame: row.launchFrame,
    endReason: row.endReason,
    error: row.error,
    request: row.request,
    reviewThreshold: row.reviewThreshold,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

const outside = (path: string, message: string, detail: string) => badRequest(detail, { errors: [{ path, message }] });

export async function startAutoMark(db: Db, jobs: AutoMarkJobs | undefined, actor: Actor, trackId: string, body: StartBody): Promise<{ runId: string }> {
  const { track } = await loadTrack(db, actor.teamId, trackId);
  const [clip] = await db.select().from(clips).where(eq(clips.id, track.clipId));
  if (!clip) throw notFound('The track’s clip is gone.');
  if (clip.status !== 'ready') {
    throw conflict(`The clip’s frames are not extracted (the clip is ${clip.status}). Extract its frames first, then start auto-marking.`);
  }
  const turned = clip.rotationDeg === 90 || clip.rotationDeg === 270;
  const width = turned ? clip.height : clip.width;
  const height = turned ? clip.width : clip.height;
  const inRange = (n: number) => n >= clip.inFrame && n <= clip.outFrame;
  const range = `frames ${clip.inFrame} to ${clip.outFrame}`;
  if (body.seed) {
    const { frameNumber, uPx, vPx } = body.seed;
    if (!inRange(frameNumber)) throw outside('body.seed.frameNumber', `must be within ${range}`, `The seed’s frame ${frameNumber} is not among the clip’s extracted ${range}.`);
    if (uPx < 0 || uPx >= width) throw outside('body.seed.uPx', `must be within 0 to ${width}`, `The seed (${uPx}, ${vPx}) is outside the ${width}×${height} frame.`);
    if (vPx < 0 || vPx >= height) throw outside('body.seed.vPx', `must be within 0 to ${height}`, `The seed (${uPx}, ${vPx}) is outside the ${width}×${height} frame.`);
  }
  if (body.fromFrame !== undefined && !inRange(body.fromFrame)) throw outside('body.fromFrame', `must be within ${range}`, `fromFrame ${body.fromFrame} is not among the clip’s ${range}.`);
  if (body.toFrame !== undefined && !inRange(body.toFrame)) throw outside('body.toFrame', `must be within ${range}`, `toFrame ${body.toFrame} is not among the clip’s ${range}.`);
  if (body.seed && ((body.fromFrame !== undefined && body.seed.frameNumber < body.fromFrame) || (body.toFrame !== undefined && body.seed.frameNumber > body.toFrame))) {
    throw outside('body.seed.frameNumber', 'must be within fromFrame to toFrame', 'The seed’s frame is outside the frames to mark.');
  }
  if (!jobs) throw new HttpProblem(503, 'Unavailable', 'The job queue is not running on this server, so auto-marking cannot start. Try again shortly.');

  const busy = () => conflict('Auto-marking is already running on this track. Wait for it to finish or cancel it first.');
  const [active] = await db
    .select({ id: autoMarkRuns.id })
    .from(autoMarkRuns)
    .where(and(eq(autoMarkRuns.trackId, track.id), inArray(autoMarkRuns.state, ['queued', 'running'])));
  if (active) throw busy();
  const reviewThreshold = await reviewThresholdOf(db, actor.teamId);
  let runId: string;
  try {
    const [row] = await db
      .insert(autoMarkRuns)
      .values({
        teamId: actor.teamId,
        trackId: track.id,
        clipId: clip.id,
        request: { seed: body.seed ?? null, fromFrame: body.fromFrame ?? null, toFrame: body.toFrame ?? null, replace: body.replace },
        reviewThreshold,
        createdBy: actor.userId,
      })
      .returning({ id: autoMarkRuns.id });
    runId = row.id;
  } catch (err) {
    // Two requests raced: the partial unique index lets only one run be at work per track.
    if ((err as { code?: string; cause?: { code?: string } }).code === '23505' || (err as { cause?: { code?: string } }).cause?.code === '23505') throw busy();
    throw err;
  }
  try {
    await jobs.enqueueAutoMark(runId);
  } catch (err) {
    await endRun(db, runId, 'failed', `The job queue did not take the run: ${(err as Error).message}`);
    throw err;
  }
  await audit(db, {
    teamId: actor.teamId,
    actorUserId: actor.userId,
    action: 'track.auto-mark',
    targetType: 'track',
    targetId: track.id,
    detail: { runId, seed: body.seed ?? null, fromFrame: body.fromFrame ?? null, toFrame: body.toFrame ?? null, replace: body.replace },
  });
  return { runId };
}

async function loadRun(db: Db, teamId: string, runId: string): Promise<RunRow> {
  const [row] = await db.select().from(autoMarkRuns).where(and(eq(autoMarkRuns.id, runId), eq(autoMarkRuns.teamId, teamId)));
  if (!row) throw notFound('No such auto-mark run in this team.');
  return row;
}

/** A run still at work whose track has gone (clip deleted) is over; say so even when no worker is there to notice. */
async function settled(db: Db, row: RunRow): Promise<RunRow> {
  if (row.state !== 'queued' && row.state !== 'running') return row;
  const [track] = await db.select({ id: tracks.id }).from(tracks).where(eq(tracks.id, row.trackId));
  if (track) return row;
  await endRun(db, row.id, 'cancelled', 'The clip or track was deleted while auto-marking ran.');
  const [fresh] = await db.select().from(autoMarkRuns).where(eq(autoMarkRuns.id, row.id));
  return fresh ?? row;
}

export async function getRun(db: Db, teamId: string, runId: string): Promise<AutoMarkRun> {
  return runView(await settled(db, await loadRun(db, teamId, runId)));
}

/** Runs of a track, newest first (the workspace looks for one at work when it opens). */
export async function listTrackRuns(db: Db, teamId: string, trackId: string): Promise<AutoMarkRun[]> {
  const { track } = await loadTrack(db, teamId, trackId);
  const rows = await db.select().from(autoMarkRuns).where(eq(autoMarkRuns.trackId, track.id)).orderBy(desc(autoMarkRuns.createdAt)).limit(20);
  return rows.map(runView);
}

export async function cancelRun(db: Db, jobs: AutoMarkJobs | undefined, actor: Actor, runId: string): Promise<AutoMarkRun> {
  const row = await loadRun(db, actor.teamId, runId);
  if (!(await endRun(db, row.id, 'cancelled', null))) throw conflict(`Nothing to cancel: the run is ${row.state}.`);
  if (row.jobId) await jobs?.cancelAutoMark(row.jobId);
  await audit(db, { teamId: actor.teamId, actorUserId: actor.userId, action: 'track.auto-mark.cancel', targetType: 'track', targetId: row.trackId, detail: { runId } });
  return getRun(db, actor.teamId, runId);
}
