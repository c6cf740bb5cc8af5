import { and, asc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { LensProfile, LensProfileCreateBody } from '../../shared/schemas/lens-profiles';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { lensProfiles } from '../db/schema/records';
import { notFound } from '../http/problem';

// Team lens profiles (shared/schemas/lens-profiles.ts). A calibration copies a
// profile's coefficients, so a profile can be edited or deleted at any time
// without touching a calibration version or a fit.

type Values = z.output<typeof LensProfileCreateBody>;
type Row = typeof lensProfiles.$inferSelect;

function toView(row: Row): LensProfile {
  const { k1, k2, k1StdUnc, k2StdUnc, k1k2Correlation } = row.coefficients;
  return {
    id: row.id,
    name: row.name,
    cameraNote: row.cameraNote,
    coefficients: { k1, k2, k1StdUnc, k2StdUnc, k1k2Correlation },
    frameWidthPx: row.frameWidthPx,
    frameHeightPx: row.frameHeightPx,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function lensProfileRecords(db: Db) {
  async function row(teamId: string, id: string): Promise<Row> {
    const [found] = await db.select().from(lensProfiles).where(and(eq(lensProfiles.teamId, teamId), eq(lensProfiles.id, id)));
    if (!found) throw notFound('No such lens profile in this team.');
    return found;
  }

  return {
    /** The stored profile, for a calibration that names it. */
    row,

    async list(teamId: string): Promise<LensProfile[]> {
      const rows = await db.select().from(lensProfiles).where(eq(lensProfiles.teamId, teamId)).orderBy(asc(lensProfiles.name), asc(lensProfiles.createdAt));
      return rows.map(toView);
    },

    async get(teamId: string, id: string): Promise<LensProfile> {
      return toView(await row(teamId, id));
    },

    async create(actor: Actor, values: Values): Promise<LensProfile> {
      return db.transaction(async (tx) => {
        const [created] = await tx.insert(lensProfiles).values({ ...values, teamId: actor.teamId }).returning();
        await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'lens-profile.create', targetType: 'lens-profile', targetId: created.id, detail: { name: created.name } });
        return toView(created);
      });
    },

    async update(actor: Actor, id: string, changes: Partial<Values>): Promise<LensProfile> {
      await row(actor.teamId, id);
      return db.transaction(async (tx) => {
        const [changed] = await tx
          .update(lensProfiles)
          .set({ ...changes, updatedAt: new Date() })
          .where(and(eq(lensProfiles.teamId, actor.teamId), eq(lensProfiles.id, id)))
          .returning();
        await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'lens-profile.update', targetType: 'lens-profile', targetId: id, detail: { fields: Object.keys(changes) } });
        return toView(changed);
      });
    },

    async remove(actor: Actor, id: string): Promise<void> {
      const { name } = await row(actor.teamId, id);
      await db.transaction(async (tx) => {
        await tx.delete(lensProfiles).where(eq(lensProfiles.id, id));
        await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'lens-profile.delete', targetType: 'lens-profile', targetId: id, detail: { name } });
      });
    },
  };
}
