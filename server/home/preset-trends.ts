// Per preset: the team's approved drag coefficients and launcher efficiencies
// over time, from approved fits of shots with the preset's launcher and projectile.
import { and, asc, eq } from 'drizzle-orm';
import { compareWithLauncherModels } from '../../shared/fits/launcher-efficiency';
import type { PresetTrend } from '../../shared/schemas/work-queues';
import type { Db } from '../db/client';
import { fits } from '../db/schema/fits';
import { designPresets } from '../db/schema/presets';
import { shots } from '../db/schema/records';

/** Most points per preset: the newest ones (a small chart, not a ledger). */
const POINTS_PER_PRESET = 60;

export async function presetTrends(db: Db, teamId: string): Promise<PresetTrend[]> {
  const presets = await db.select({ id: designPresets.id, name: designPresets.name, launcherId: designPresets.launcherId, projectileId: designPresets.projectileId }).from(designPresets).where(eq(designPresets.teamId, teamId)).orderBy(asc(designPresets.name));
  if (presets.length === 0) return [];
  const approved = await db
    .select({ id: fits.id, label: shots.label, launcherId: shots.launcherId, projectileId: shots.projectileId, at: fits.reviewedAt, createdAt: fits.createdAt, cd: fits.dragCoefficient, result: fits.result, snapshot: fits.inputSnapshot })
    .from(fits)
    .innerJoin(shots, eq(shots.id, fits.shotId))
    .where(and(eq(fits.teamId, teamId), eq(fits.state, 'approved')))
    .orderBy(asc(fits.reviewedAt));
  return presets.map((p) => ({
    presetId: p.id,
    name: p.name,
    points: approved
      .filter((f) => f.launcherId === p.launcherId && f.projectileId === p.projectileId)
      .slice(-POINTS_PER_PRESET)
      .map((f) => {
        const rows = compareWithLauncherModels(f.result, f.snapshot).rows;
        const efficiency = rows.find((r) => r.model === 'adiabatic')?.efficiency ?? rows.find((r) => r.model === 'constant-pressure')?.efficiency ?? null;
        return { fitId: f.id, shotLabel: f.label, at: (f.at ?? f.createdAt).toISOString(), dragCoefficient: f.cd, launcherEfficiency: efficiency };
      }),
  }));
}
