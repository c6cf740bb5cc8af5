import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { tracks } from '../db/schema/marking';
import { notFound } from '../http/problem';

// Clips and tracks are looked up together with the team from the path, so a
// member of one team can never reach another team's clip by its id.

export interface ClipScope {
  id: string;
  teamId: string;
  captureFps: number;
  frameCount: number;
}

const clipColumns = { id: clips.id, teamId: clips.teamId, captureFps: clips.captureFps, frameCount: clips.frameCount };

export async function loadClip(db: Pick<Db, 'select'>, teamId: string, clipId: string): Promise<ClipScope> {
  const [clip] = await db.select(clipColumns).from(clips).where(and(eq(clips.id, clipId), eq(clips.teamId, teamId)));
  if (!clip) throw notFound('No such clip in this team.');
  return clip;
}

export type TrackRow = typeof tracks.$inferSelect;

export async function loadTrack(db: Pick<Db, 'select'>, teamId: string, trackId: string): Promise<{ track: TrackRow; clip: ClipScope }> {
  const [row] = await db
    .select({ track: tracks, clip: clipColumns })
    .from(tracks)
    .innerJoin(clips, eq(clips.id, tracks.clipId))
    .where(and(eq(tracks.id, trackId), eq(tracks.teamId, teamId)));
  if (!row) throw notFound('No such track in this team.');
  return row;
}
