// Hand-offs of the marking stage: an analyst's first calibration makes a clip
// ready to mark (frame markers hear of it); a frame marker's "marking done" moves
// the track to the engineers' queue (engineers hear of it). Undo is the same
// action with done = false.
import { and, count, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { CalibrationCreateBody, MarkingDoneBody, Track } from '../../shared/schemas/marking';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import { clips } from '../db/schema/clips';
import { marks, tracks } from '../db/schema/marking';
import { shots } from '../db/schema/records';
import { teams } from '../db/schema/teams';
import { unprocessable } from '../http/problem';
import { appLink, membersInRoles, notifyPeople } from '../notifications/hand-off-mail';
import { calibrateClip } from './calibrations';
import { loadTrack } from './scope';
import { getTrack } from './tracks';

type HandOffDeps = Pick<AppDeps, 'db' | 'mailer' | 'config'>;

async function clipContext(db: AppDeps['db'], clipId: string) {
  const [row] = await db
    .select({ shotId: clips.shotId, shotLabel: shots.label, teamName: teams.name, fileName: clips.originalName })
    .from(clips)
    .innerJoin(shots, eq(shots.id, clips.shotId))
    .innerJoin(teams, eq(teams.id, clips.teamId))
    .where(eq(clips.id, clipId));
  return row;
}

/** Stores a calibration; the clip's first one tells the team's frame markers it is ready to mark. */
export async function calibrateAndHandOff(deps: HandOffDeps, actor: Actor, clipId: string, body: z.output<typeof CalibrationCreateBody>) {
  const calibration = await calibrateClip(deps.db, actor, clipId, body);
  if (calibration?.version === 1) {
    const ctx = await clipContext(deps.db, clipId);
    const people = await membersInRoles(deps.db, actor.teamId, ['tracker'], actor.userId);
    await notifyPeople(deps, people, {
      teamId: actor.teamId,
      kind: 'clip-ready-to-mark',
      subject: `Clip ready to mark: ${ctx.shotLabel}`,
      text: [
        `A clip of shot "${ctx.shotLabel}" in ${ctx.teamName} is calibrated and ready to mark.`,
        '',
        `Open it: ${appLink(deps.config.publicUrl, `/t/${actor.teamId}/clips/${clipId}/workspace`)}`,
      ].join('\n'),
    });
  }
  return calibration;
}

/** Marks a track done (it moves to the engineers' queue) or takes it back. */
export async function setMarkingDone(deps: HandOffDeps, actor: Actor, trackId: string, body: z.output<typeof MarkingDoneBody>): Promise<Track> {
  const { db } = deps;
  const { track, clip } = await loadTrack(db, actor.teamId, trackId);
  if (body.done && track.markingDoneAt) return getTrack(db, actor.teamId, trackId);
  if (body.done) {
    const [{ n }] = await db.select({ n: count() }).from(marks).where(eq(marks.trackId, track.id));
    // Five marks is the least the fit page will run a fit on.
    if (n < 5) throw unprocessable(`This track has ${n} ${n === 1 ? 'mark' : 'marks'}; mark at least 5 frames before handing it to the engineers.`);
  }
  await db.transaction(async (tx) => {
    await tx
      .update(tracks)
      .set(body.done ? { markingDoneAt: new Date(), markingDoneBy: actor.userId } : { markingDoneAt: null, markingDoneBy: null })
      .where(and(eq(tracks.id, track.id), eq(tracks.teamId, actor.teamId)));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: body.done ? 'track.marking-done' : 'track.marking-reopened', targetType: 'track', targetId: track.id, detail: { clipId: clip.id } });
  });
  if (body.done) {
    const ctx = await clipContext(db, clip.id);
    const engineers = await membersInRoles(db, actor.teamId, ['engineer'], actor.userId);
    await notifyPeople(deps, engineers, {
      teamId: actor.teamId,
      kind: 'track-ready-to-fit',
      subject: `Marking done: ${ctx.shotLabel}`,
      text: [
        `Track "${track.name}" of shot "${ctx.shotLabel}" in ${ctx.teamName} is marked and ready for a fit.`,
        '',
        `Open the shot's fits: ${appLink(deps.config.publicUrl, `/t/${actor.teamId}/shots/${ctx.shotId}/fits`)}`,
      ].join('\n'),
    });
  }
  return getTrack(db, actor.teamId, trackId);
}
