// Recent activity of a team, from its audit log, in plain words and with a frame
// of the clip the entry concerns (its middle thumbnail), when there is one.
import { and, desc, eq, inArray } from 'drizzle-orm';
import type { ActivityEntry } from '../../shared/schemas/work-queues';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema/audit-events';
import { clips } from '../db/schema/clips';
import { fits } from '../db/schema/fits';
import { tracks } from '../db/schema/marking';
import { users } from '../db/schema/users';

const WORDS: Record<string, string> = {
  'clip.upload': 'uploaded a clip',
  'calibration.create': 'calibrated a clip',
  'track.auto-mark': 'started automatic marking',
  'marks.import': 'imported marks',
  'track.marking-done': 'finished marking a track',
  'track.marking-reopened': 'reopened a track for marking',
  'fit.run': 'ran a fit',
  'fit.approve': 'approved a fit',
  'fit.reject': 'rejected a fit',
  'preset.publish': 'published a preset version',
  'invitation.accepted': 'joined the team',
};

const ACTIVITY_LIMIT = 12;

export async function recentActivity(db: Db, teamId: string): Promise<ActivityEntry[]> {
  const events = await db
    .select({ id: auditEvents.id, action: auditEvents.action, targetType: auditEvents.targetType, targetId: auditEvents.targetId, detail: auditEvents.detail, at: auditEvents.createdAt, actor: users.displayName })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(and(eq(auditEvents.teamId, teamId), inArray(auditEvents.action, Object.keys(WORDS))))
    .orderBy(desc(auditEvents.createdAt))
    .limit(ACTIVITY_LIMIT);

  // Which clip each entry is about: directly, through its track, or through its fit.
  const clipOf = (e: (typeof events)[number]): string | null => {
    if (e.targetType === 'clip') return e.targetId;
    if (typeof e.detail.clipId === 'string') return e.detail.clipId;
    return null;
  };
  const fitIds = events.filter((e) => e.targetType === 'fit' && e.targetId).map((e) => e.targetId!);
  const trackIds = events.filter((e) => e.targetType === 'track' && e.targetId && !clipOf(e)).map((e) => e.targetId!);
  const fitClips = new Map(fitIds.length ? (await db.select({ id: fits.id, clipId: fits.clipId, shotId: fits.shotId }).from(fits).where(inArray(fits.id, fitIds))).map((f) => [f.id, f]) : []);
  const trackClips = new Map(trackIds.length ? (await db.select({ id: tracks.id, clipId: tracks.clipId }).from(tracks).where(inArray(tracks.id, trackIds))).map((t) => [t.id, t.clipId]) : []);
  const clipIdOf = (e: (typeof events)[number]) => clipOf(e) ?? (e.targetType === 'fit' ? fitClips.get(e.targetId!)?.clipId : e.targetType === 'track' ? trackClips.get(e.targetId!) : null) ?? null;
  const clipIds = [...new Set(events.map(clipIdOf).filter((id): id is string => !!id))];
  const clipRows = new Map(
    clipIds.length
      ? (await db.select({ id: clips.id, thumbs: clips.thumbnailCount, shotId: clips.shotId }).from(clips).where(and(eq(clips.teamId, teamId), inArray(clips.id, clipIds)))).map((c) => [c.id, c])
      : [],
  );

  return events.map((e) => {
    const clip = clipRows.get(clipIdOf(e) ?? '');
    const href =
      e.targetType === 'fit' && fitClips.has(e.targetId!)
        ? `/t/${teamId}/fits/${e.targetId}`
        : clip
          ? `/t/${teamId}/clips/${clip.id}/workspace`
          : null;
    return {
      id: e.id,
      text: WORDS[e.action],
      actor: e.actor,
      at: e.at.toISOString(),
      href,
      thumbnail: clip && clip.thumbs > 0 ? { clipId: clip.id, n: Math.floor(clip.thumbs / 2) } : null,
    };
  });
}
