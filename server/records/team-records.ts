import { and, asc, count, eq, getTableColumns } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { designPresets } from '../db/schema/presets';
import { launchers, projectiles, shots } from '../db/schema/records';
import { conflict, notFound } from '../http/problem';

/** Tables whose rows are plain team equipment records: same lifecycle, same in-use rule. */
type TeamRecordTable = typeof launchers | typeof projectiles;

export interface TeamRecordKind {
  table: TeamRecordTable;
  /** Singular noun used in audit actions, target types and messages. */
  noun: 'launcher' | 'projectile';
  /** The shot column and the preset column that name a record of this kind. */
  shotColumn: PgColumn;
  presetColumn: PgColumn;
}

/**
 * Create / list / get / update / delete for one kind of team record.
 * A record still named by shots or design presets cannot be deleted (409), so nothing silently loses it.
 */
export function teamRecordService(db: Db, kind: TeamRecordKind) {
  // Narrowed to one member of the union for the query builder; both tables have id, teamId and name.
  const table = kind.table as typeof launchers;
  const { teamId: _teamId, ...columns } = getTableColumns(table);
  const { noun } = kind;

  async function get(teamId: string, id: string): Promise<Row> {
    const [row] = await db.select(columns).from(table).where(and(eq(table.teamId, teamId), eq(table.id, id)));
    if (!row) throw notFound(`No such ${noun} in this team.`);
    return row;
  }

  async function list(teamId: string): Promise<Row[]> {
    return db.select(columns).from(table).where(eq(table.teamId, teamId)).orderBy(asc(table.name));
  }

  async function create(actor: Actor, values: Values): Promise<Row> {
    return db.transaction(async (tx) => {
      const [created] = await tx
        .insert(table)
        .values({ ...(values as typeof launchers.$inferInsert), teamId: actor.teamId })
        .returning(columns);
      await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: `${noun}.create`, targetType: noun, targetId: created.id, detail: { name: created.name } });
      return created;
    });
  }

  async function update(actor: Actor, id: string, changes: Partial<Values>): Promise<Row> {
    await get(actor.teamId, id);
    return db.transaction(async (tx) => {
      const [changed] = await tx
        .update(table)
        .set(changes as Partial<typeof launchers.$inferInsert>)
        .where(and(eq(table.teamId, actor.teamId), eq(table.id, id)))
        .returning(columns);
      await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: `${noun}.update`, targetType: noun, targetId: id, detail: { fields: Object.keys(changes) } });
      return changed;
    });
  }

  async function remove(actor: Actor, id: string): Promise<void> {
    const record = await get(actor.teamId, id);
    const { name } = record;
    await db.transaction(async (tx) => {
      const [{ n }] = await tx.select({ n: count() }).from(shots).where(eq(kind.shotColumn, id));
      if (n > 0) throw conflict(`${n} shot${n === 1 ? '' : 's'} name${n === 1 ? 's' : ''} the ${noun} “${name}”; it cannot be deleted while they do.`, { shotCount: n });
      // A design preset forecasts from this record; deleting it would orphan the preset's versions.
      const [{ p }] = await tx.select({ p: count() }).from(designPresets).where(eq(kind.presetColumn, id));
      if (p > 0) throw conflict(`${p} design preset${p === 1 ? '' : 's'} use${p === 1 ? 's' : ''} the ${noun} “${name}”; it cannot be deleted while they do.`, { presetCount: p });
      await tx.delete(table).where(eq(table.id, id));
      await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: `${noun}.delete`, targetType: noun, targetId: id, detail: { name } });
    });
  }

  return { list, get, create, update, remove };
}

/** A stored record as the API returns it; the columns beyond id and name differ per kind. */
type Row = { id: string; name: string; createdAt: Date } & Record<string, unknown>;
/** Validated body fields; the zod schema of each kind decides which. */
type Values = Record<string, unknown>;

export type TeamRecordService = ReturnType<typeof teamRecordService>;

export const launcherRecords = (db: Db) =>
  teamRecordService(db, { table: launchers, noun: 'launcher', shotColumn: shots.launcherId, presetColumn: designPresets.launcherId });

export const projectileRecords = (db: Db) =>
  teamRecordService(db, { table: projectiles, noun: 'projectile', shotColumn: shots.projectileId, presetColumn: designPresets.projectileId });
