import { and, asc, count, eq, type SQL } from 'drizzle-orm';
import type { z } from 'zod';
import type { Track, TrackCreateBody, TrackUpdateBody } from '../../shared/schemas/marking';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { marks, tracks } from '../db/schema/marking';
import { users } from '../db/schema/users';
import { loadClip, loadTrack } from './scope';

// Tracks: named series of marks on one clip (the projectile, or a muzzle point).

async function trackViews(db: Db, where: SQL): Promise<Track[]> {
  const rows = await db
    .select({ track: tracks, markCount: count(marks.frameNumber), doneBy: { id: users.id, displayName: users.displayName } })
    .from(tracks)
    .leftJoin(marks, eq(marks.trackId, tracks.id))
    .leftJoin(users, eq(users.id, tracks.markingDoneBy))
    .where(where)
    .groupBy(tracks.id, users.id)
    .orderBy(asc(tracks.createdAt), asc(tracks.id));
  return rows.map(({ track, markCount, doneBy }) => ({
    id: track.id,
    clipId: track.clipId,
    teamId: track.teamId,
    name: track.name,
    kind: track.kind,
    revision: track.revision,
    markCount,
    markingDone: track.markingDoneAt ? { at: track.markingDoneAt.toISOString(), by: doneBy?.id ? { id: doneBy.id, displayName: doneBy.displayName } : null } : null,
    createdAt: track.createdAt.toISOString(),
  }));
}

/** Tracks of the team's clip, oldest first. */
export async function clipTracks(db: Db, teamId: string, clipId: string): Promise<Track[]> {
  const clip = await loadClip(db, teamId, clipId);
  return trackViews(db, eq(tracks.clipId, clip.id));
}

export async function getTrack(db: Db, teamId: string, trackId: string): Promise<Track> {
  const { track } = await loadTrack(db, teamId, trackId);
  return (await trackViews(db, eq(tracks.id, track.id)))[0];
}

export async function createTrack(db: Db, actor: Actor, clipId: string, body: z.output<typeof TrackCreateBody>): Promise<Track> {
  const clip = await loadClip(db, actor.teamId, clipId);
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(tracks).values({ clipId: clip.id, teamId: actor.teamId, name: body.name, kind: body.kind, createdBy: actor.userId }).returning({ id: tracks.id });
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'track.create', targetType: 'track', targetId: row.id, detail: { clipId: clip.id, name: body.name, kind: body.kind } });
    return row.id;
  });
  return (await trackViews(db, eq(tracks.id, id)))[0];
}

/** Renames a track or changes its kind. */
export async function updateTrack(db: Db, actor: Actor, trackId: string, body: z.output<typeof TrackUpdateBody>): Promise<Track> {
  const { track } = await loadTrack(db, actor.teamId, trackId);
  await db.transaction(async (tx) => {
    await tx.update(tracks).set(body).where(and(eq(tracks.id, track.id), eq(tracks.teamId, actor.teamId)));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'track.update', targetType: 'track', targetId: track.id, detail: { fields: Object.keys(body) } });
  });
  return (await trackViews(db, eq(tracks.id, track.id)))[0];
}

/** Deletes a track and its marks; the audit entry keeps how many marks went with it. */
export async function deleteTrack(db: Db, actor: Actor, trackId: string): Promise<void> {
  const { track } = await loadTrack(db, actor.teamId, trackId);
  await db.transaction(async (tx) => {
    const [{ n }] = await tx.select({ n: count() }).from(marks).where(eq(marks.trackId, track.id));
    await tx.delete(tracks).where(eq(tracks.id, track.id));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'track.delete', targetType: 'track', targetId: track.id, detail: { clipId: track.clipId, name: track.name, markCount: n } });
  });
}
