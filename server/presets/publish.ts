// Creating a preset (version 1 from a handbook value and a stated efficiency
// assumption) and publishing a new version pooled from approved fits. Used by
// the routes and by the demo seed, so both follow the same rules.
import { and, eq, sql } from 'drizzle-orm';
import { formatPressureKPa } from '../../shared/fits/format';
import { HANDBOOK_DRAG } from '../../shared/physics/handbook-drag';
import { poolInverseVariance, type PooledValue } from '../../shared/presets/pool';
import { launcherModelFor, missingGeometry } from '../../shared/presets/launcher-speed';
import type { z } from 'zod';
import type { PoolPreview, PooledSummary, PresetCreateBody } from '../../shared/schemas/presets';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { designPresets, fitPresetComparisons, presetVersions } from '../db/schema/presets';
import { launchers, projectiles } from '../db/schema/records';
import { conflict, unprocessable } from '../http/problem';
import { candidateOf, pickVersion, teamFitsByIds, type LoadedPreset } from './preset-store';

/**
 * Relative standard uncertainty given to a handbook Cd: the tables hold for a
 * smooth body in a stated Reynolds-number range, real projectiles differ
 * (seams, surface, shape), so ±10 % one sigma (common practice; the handbook
 * table itself marks several entries "from memory").
 */
export const HANDBOOK_CD_REL_STD = 0.1;

type CreateInput = z.output<typeof PresetCreateBody>;

export async function createPreset(db: Db, teamId: string, userId: string | null, body: CreateInput): Promise<string> {
  const entry = HANDBOOK_DRAG.find((h) => h.body === body.handbookBody);
  if (!entry) throw unprocessable(`“${body.handbookBody}” is not in the handbook drag table; choose one of: ${HANDBOOK_DRAG.map((h) => h.body).join('; ')}.`);
  const [launcher] = await db.select().from(launchers).where(and(eq(launchers.teamId, teamId), eq(launchers.id, body.launcherId)));
  if (!launcher) throw unprocessable('The launcher is not one of this team’s launchers.', { errors: [{ path: 'body.launcherId', message: 'is not a launcher of this team' }] });
  const [projectile] = await db.select().from(projectiles).where(and(eq(projectiles.teamId, teamId), eq(projectiles.id, body.projectileId)));
  if (!projectile) throw unprocessable('The projectile is not one of this team’s projectiles.', { errors: [{ path: 'body.projectileId', message: 'is not a projectile of this team' }] });
  const missing = missingGeometry(launcher);
  if (missing.length > 0) throw unprocessable(`A preset forecasts speed from the launcher model, which needs the ${missing.join(' and ')}; add them to “${launcher.name}” first.`);
  if (launcher.maxWorkingPressurePa !== null && body.pressureMaxPa > launcher.maxWorkingPressurePa) {
    throw unprocessable(`The preset’s maximum pressure is above the launcher’s maximum working pressure (${formatPressureKPa(launcher.maxWorkingPressurePa)}).`, {
      errors: [{ path: 'body.pressureMaxPa', message: 'is above the launcher’s maximum working pressure' }],
    });
  }
  return db.transaction(async (tx) => {
    const [dup] = await tx.select({ id: designPresets.id }).from(designPresets).where(and(eq(designPresets.teamId, teamId), eq(designPresets.name, body.name)));
    if (dup) throw conflict(`A preset named “${body.name}” already exists in this team.`);
    const [preset] = await tx
      .insert(designPresets)
      .values({ teamId, name: body.name, launcherId: launcher.id, projectileId: projectile.id, pressureMinPa: body.pressureMinPa, pressureMaxPa: body.pressureMaxPa, createdBy: userId })
      .returning({ id: designPresets.id });
    const [v1] = await tx
      .insert(presetVersions)
      .values({
        presetId: preset.id,
        version: 1,
        dragCoefficient: entry.dragCoefficient,
        dragCoefficientStd: entry.dragCoefficient * HANDBOOK_CD_REL_STD,
        efficiency: body.efficiency,
        efficiencyStd: body.efficiencyStd,
        launcherModel: launcherModelFor(launcher),
        dragSource: `handbook: ${entry.body} ${entry.dragCoefficient}, ${entry.source}; ±${HANDBOOK_CD_REL_STD * 100} % assumed for a real projectile`,
        efficiencySource: `assumption: ${body.efficiency} ± ${body.efficiencyStd}` + (body.efficiencyNote ? ` (${body.efficiencyNote})` : ' (no fits yet; stated wide on purpose)'),
        pooledFitIds: [],
        heterogeneity: null,
        keepOutSafetyFactor: body.safetyFactor,
        note: body.note,
        publishedBy: userId,
      })
      .returning({ id: presetVersions.id });
    await audit(tx, { teamId, actorUserId: userId, action: 'preset.create', targetType: 'preset', targetId: preset.id, detail: { name: body.name, versionId: v1.id, dragCoefficient: entry.dragCoefficient } });
    return preset.id;
  });
}

function summaryOf(p: PooledValue): PooledSummary {
  const h = p.heterogeneity;
  return { value: p.value, stdErr: p.stdErr, stdErrFixed: p.stdErrFixed, count: p.count, cochranQ: h.cochranQ, degreesOfFreedom: h.degreesOfFreedom, iSquared: h.iSquared, pValue: h.pValue, birgeRatio: h.birgeRatio, disagree: h.disagree, verdict: h.verdict };
}

/**
 * Pools the named fits. Every id must be an approved fit of this team (409 for
 * another state, 422 for an unknown id or another launcher or projectile), and
 * at least one must carry a drag coefficient with an uncertainty.
 */
export async function poolFits(db: Db, teamId: string, l: LoadedPreset, fitIds: string[]): Promise<PoolPreview> {
  const ids = [...new Set(fitIds)];
  const rows = await teamFitsByIds(db, teamId, ids);
  const found = new Set(rows.map((r) => r.id));
  const unknown = ids.filter((id) => !found.has(id));
  if (unknown.length > 0) throw unprocessable(`${unknown.length} of the chosen fits ${unknown.length === 1 ? 'is' : 'are'} not fits of this team.`, { fitIds: unknown });
  const notApproved = rows.filter((r) => r.state !== 'approved');
  if (notApproved.length > 0) {
    throw conflict(`Only approved fits can go into a preset; ${notApproved.map((r) => `${r.shotLabel} is ${r.state}`).join(', ')}.`, { fitIds: notApproved.map((r) => r.id) });
  }
  const mismatched = rows.filter((r) => r.launcherId !== l.launcher.id || r.projectileId !== l.projectile.id);
  if (mismatched.length > 0) {
    throw unprocessable(`These fits are of shots with another launcher or projectile than the preset’s: ${mismatched.map((r) => r.shotLabel).join(', ')}.`, { fitIds: mismatched.map((r) => r.id) });
  }
  const candidates = rows.map((r) => candidateOf(r, l));
  const notes = candidates.flatMap((c) => c.notes.map((n) => `${c.shotLabel}: ${n}`));
  const cds = candidates.filter((c) => c.dragCoefficient).map((c) => ({ id: c.fitId, ...c.dragCoefficient! }));
  if (cds.length === 0) throw unprocessable('None of the chosen fits resolved a drag coefficient with an uncertainty, so there is nothing to pool.', { notes });
  const etas = candidates.filter((c) => c.efficiency).map((c) => ({ id: c.fitId, value: c.efficiency!.value, stdErr: c.efficiency!.stdErr }));
  return {
    dragCoefficient: summaryOf(poolInverseVariance(cds)),
    efficiency: etas.length > 0 ? summaryOf(poolInverseVariance(etas)) : null,
    fitIds: ids,
    notes,
  };
}

export interface PublishInput {
  fitIds: string[];
  note: string;
  safetyFactor?: number;
}

export async function publishVersion(db: Db, teamId: string, userId: string | null, l: LoadedPreset, body: PublishInput): Promise<number> {
  const pooled = await poolFits(db, teamId, l, body.fitIds);
  return db.transaction(async (tx) => {
    // Lock the preset row so two engineers publishing at once get versions n+1 and n+2, not a clash.
    await tx.execute(sql`select id from design_presets where id = ${l.preset.id} for update`);
    const previous = await pickVersion(tx, l.preset.id);
    const cd = pooled.dragCoefficient;
    const eta = pooled.efficiency;
    const cdCount = cd.count;
    const [row] = await tx
      .insert(presetVersions)
      .values({
        presetId: l.preset.id,
        version: previous.version + 1,
        dragCoefficient: cd.value,
        dragCoefficientStd: cd.stdErr,
        efficiency: eta ? eta.value : previous.efficiency,
        efficiencyStd: eta ? eta.stdErr : previous.efficiencyStd,
        launcherModel: launcherModelFor(l.launcher),
        dragSource: `pooled from ${cdCount} approved fit${cdCount === 1 ? '' : 's'} (inverse-variance weighted mean${cd.disagree ? ', uncertainty widened by the Birge ratio' : ''})`,
        efficiencySource: eta
          ? `pooled from ${eta.count} approved fit${eta.count === 1 ? '' : 's'}: measured speed against the ${launcherModelFor(l.launcher)} model at each shot’s pressure`
          : `carried from version ${previous.version}: ${previous.efficiencySource}`,
        pooledFitIds: pooled.fitIds,
        heterogeneity: { dragCoefficient: cd, efficiency: eta },
        keepOutSafetyFactor: body.safetyFactor ?? previous.keepOutSafetyFactor,
        note: body.note,
        publishedBy: userId,
      })
      .returning({ id: presetVersions.id, version: presetVersions.version });
    await tx.insert(fitPresetComparisons).values(pooled.fitIds.map((fitId) => ({ fitId, presetVersionId: row.id, role: 'pooled' as const }))).onConflictDoNothing();
    await audit(tx, {
      teamId,
      actorUserId: userId,
      action: 'preset.publish',
      targetType: 'preset',
      targetId: l.preset.id,
      detail: { version: row.version, fitIds: pooled.fitIds, dragCoefficient: cd.value, dragCoefficientStd: cd.stdErr },
    });
    return row.version;
  });
}

