import { and, eq, getTableColumns, sql } from 'drizzle-orm';
import type { Db, Tx } from '../db/client';
import { marks, tracks } from '../db/schema/marking';
import { users } from '../db/schema/users';
import { notFound } from '../http/problem';
import type { MarkRow } from './mark-views';

// Every write on a track first bumps the track's revision, which row-locks the
// track: writes on one track are serialised (briefly), never lost. The mark
// takes the new track revision as its own, so a mark revision is never reused
// within a track (deleting and re-creating a mark cannot fool a stale writer).
// The write itself is one INSERT … ON CONFLICT DO UPDATE … WHERE revision =
// expected, so a stale writer changes nothing.

export interface MarkValues {
  uPx: number;
  vPx: number;
  placedUPx: number;
  placedVPx: number;
  snapped: boolean;
}

/** Thrown inside the transaction to roll it back; carries what the 409 needs. */
export class StaleMarkWrite extends Error {
  constructor(
    readonly current: { mark: MarkRow; updaterName: string | null } | null,
    readonly trackRevision: number,
  ) {
    super('stale mark write');
  }
}

/** A person's write makes the mark theirs, whatever placed it before (an automatic mark accepted or moved included). */
function byPerson(snapped: boolean) {
  return { source: snapped ? ('snap' as const) : ('hand' as const), confidence: null, lowConfidenceReason: null, autoMarkRunId: null };
}

export async function bumpTrackRevision(tx: Tx, trackId: string, whenGone: () => Error = () => notFound('No such track in this team.')): Promise<number> {
  const [bumped] = await tx
    .update(tracks)
    .set({ revision: sql`${tracks.revision} + 1` })
    .where(eq(tracks.id, trackId))
    .returning({ revision: tracks.revision });
  if (!bumped) throw whenGone();
  return bumped.revision;
}

/**
 * Writes whole mark rows, one per (track, frame): an existing mark on a frame
 * takes every column of the new row. With `overAutoOnly`, a mark a person
 * placed stays as it is (the automatic marker never overwrites people).
 */
export async function upsertMarkRows(tx: Tx, rows: (typeof marks.$inferInsert)[], opts: { overAutoOnly?: boolean } = {}): Promise<void> {
  if (rows.length === 0) return;
  await tx
    .insert(marks)
    .values(rows)
    .onConflictDoUpdate({
      target: [marks.trackId, marks.frameNumber],
      set: {
        uPx: sql`excluded.u_px`,
        vPx: sql`excluded.v_px`,
        placedUPx: sql`excluded.placed_u_px`,
        placedVPx: sql`excluded.placed_v_px`,
        snapped: sql`excluded.snapped`,
        source: sql`excluded.source`,
        confidence: sql`excluded.confidence`,
        lowConfidenceReason: sql`excluded.low_confidence_reason`,
        autoMarkRunId: sql`excluded.auto_mark_run_id`,
        revision: sql`excluded.revision`,
        updatedBy: sql`excluded.updated_by`,
        updatedAt: sql`excluded.updated_at`,
      },
      ...(opts.overAutoOnly ? { setWhere: eq(marks.source, 'auto') } : {}),
    });
}

async function storedMark(tx: Tx, trackId: string, frameNumber: number) {
  const [row] = await tx
    .select({ mark: marks, updaterName: users.displayName })
    .from(marks)
    .leftJoin(users, eq(users.id, marks.updatedBy))
    .where(and(eq(marks.trackId, trackId), eq(marks.frameNumber, frameNumber)));
  return row ?? null;
}

/**
 * expectedRevision null: create only. A number: update only that revision;
 * if the mark has gone meanwhile the insert branch ran, which we treat as
 * stale too (someone deleted what the writer was looking at).
 */
export async function upsertMark(
  db: Db,
  args: { trackId: string; frameNumber: number; values: MarkValues; expectedRevision: number | null; userId: string },
): Promise<{ mark: MarkRow; created: boolean; trackRevision: number }> {
  return db.transaction(async (tx) => {
    const revision = await bumpTrackRevision(tx, args.trackId);
    const now = new Date();
    const rows = await tx
      .insert(marks)
      .values({ trackId: args.trackId, frameNumber: args.frameNumber, ...args.values, ...byPerson(args.values.snapped), revision, updatedBy: args.userId, updatedAt: now })
      .onConflictDoUpdate({
        target: [marks.trackId, marks.frameNumber],
        set: { ...args.values, ...byPerson(args.values.snapped), revision, updatedBy: args.userId, updatedAt: now },
        setWhere: args.expectedRevision === null ? sql`false` : eq(marks.revision, args.expectedRevision),
      })
      .returning({ ...getTableColumns(marks), inserted: sql<boolean>`(xmax = 0)` });
    const written = rows[0];
    if (!written || (args.expectedRevision !== null && written.inserted)) {
      const current = written ? null : await storedMark(tx, args.trackId, args.frameNumber);
      throw new StaleMarkWrite(current, revision - 1);
    }
    const { inserted, ...mark } = written;
    return { mark, created: inserted, trackRevision: revision };
  });
}

/** Deletes the mark only if it still has the expected revision. */
export async function deleteMark(
  db: Db,
  args: { trackId: string; frameNumber: number; expectedRevision: number },
): Promise<{ deleted: MarkRow; trackRevision: number }> {
  return db.transaction(async (tx) => {
    const revision = await bumpTrackRevision(tx, args.trackId);
    const [deleted] = await tx
      .delete(marks)
      .where(and(eq(marks.trackId, args.trackId), eq(marks.frameNumber, args.frameNumber), eq(marks.revision, args.expectedRevision)))
      .returning();
    if (!deleted) {
      const current = await storedMark(tx, args.trackId, args.frameNumber);
      if (!current) throw notFound(`Frame ${args.frameNumber} has no mark on this track.`);
      throw new StaleMarkWrite(current, revision - 1);
    }
    return { deleted, trackRevision: revision };
  });
}

/** Stores a whole file's marks in one transaction; `replace` first removes the track's other marks. */
export async function importMarks(
  tx: Tx,
  args: { trackId: string; rows: (MarkValues & { frameNumber: number })[]; replace: boolean; userId: string },
): Promise<number> {
  const revision = await bumpTrackRevision(tx, args.trackId);
  if (args.replace) await tx.delete(marks).where(eq(marks.trackId, args.trackId));
  const now = new Date();
  for (let i = 0; i < args.rows.length; i += 1000) {
    const chunk = args.rows.slice(i, i + 1000).map((r) => ({ trackId: args.trackId, ...r, ...byPerson(r.snapped), revision, updatedBy: args.userId, updatedAt: now }));
    await upsertMarkRows(tx, chunk);
  }
  return revision;
}
