import { count, eq, sql } from 'drizzle-orm';
import type { ClipStatus } from '../../shared/schemas/clips';
import type { Db } from './client';
import { clips } from './schema/clips';
import { shots } from './schema/records';

// What the shot records need to know about a shot's clips (the clips area owns the table).

/** The shot's newest clip as {id, status, progress}, or null; a correlated subquery so one query serves a whole page. */
export function latestClipColumn() {
  return sql<{ id: string; status: ClipStatus; progress: number } | null>`(
    select json_build_object('id', ${clips.id}, 'status', ${clips.status}, 'progress', ${clips.progress})
    from ${clips} where ${clips.shotId} = ${shots.id}
    order by ${clips.createdAt} desc limit 1)`;
}

export async function shotClipCount(db: Pick<Db, 'select'>, shotId: string): Promise<number> {
  const [{ n }] = await db.select({ n: count() }).from(clips).where(eq(clips.shotId, shotId));
  return n;
}
