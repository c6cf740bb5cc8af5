import { and, desc, eq } from 'drizzle-orm';
import type { FitPresetComparison, PresetVersion } from '../../shared/schemas/presets';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db } from '../db/client';
import { fits } from '../db/schema/fits';
import { designPresets, fitPresetComparisons, presetVersions } from '../db/schema/presets';
import { notFound, unprocessable } from '../http/problem';
import { createPreset, poolFits, publishVersion } from './publish';
import { approvedFitsForPreset, candidateOf, loadPreset, pickVersion, presetDetail, teamFitsByIds, versionRows, versionViews } from './preset-store';

// Design presets: versioned Cd and launcher efficiency for a launcher and
// projectile, pooled from approved fits. Versions are immutable; publishing adds one.

type CreateInput = Parameters<typeof createPreset>[3];
type PublishInput = Parameters<typeof publishVersion>[4];

/** Creates a preset (version 1 from a handbook Cd and a stated efficiency) and returns its detail. */
export async function createPresetDetail(db: Db, actor: Actor, body: CreateInput) {
  const id = await createPreset(db, actor.teamId, actor.userId, body);
  return presetDetail(db, actor.teamId, id);
}

/** Approved fits of the preset's launcher and projectile, with what each would contribute. */
export async function presetCandidates(db: Db, teamId: string, presetId: string) {
  const l = await loadPreset(db, teamId, presetId);
  return (await approvedFitsForPreset(db, teamId, l)).map((f) => candidateOf(f, l));
}

/** Pools chosen approved fits without publishing. */
export async function previewPool(db: Db, teamId: string, presetId: string, fitIds: string[]) {
  const l = await loadPreset(db, teamId, presetId);
  return poolFits(db, teamId, l, fitIds);
}

/** Publishes a new version pooled from approved fits and returns it as listed. */
export async function publishPresetVersion(db: Db, actor: Actor, presetId: string, body: PublishInput) {
  const l = await loadPreset(db, actor.teamId, presetId);
  const version = await publishVersion(db, actor.teamId, actor.userId, l, body);
  const views = versionViews(await versionRows(db, l.preset.id));
  return views.find((v) => v.version === version);
}

/** One version of the team's preset, however old (404 when it has no such version). */
export async function presetVersion(db: Db, teamId: string, presetId: string, version: number): Promise<PresetVersion> {
  await loadPreset(db, teamId, presetId);
  const views = versionViews(await versionRows(db, presetId));
  const found = views.find((v) => v.version === version);
  if (!found) throw notFound(`The preset has no version ${version}.`);
  return found;
}

/** Records that approved fits of this team were compared against a version. */
export async function recordComparisons(db: Db, actor: Actor, presetId: string, version: number, fitIds: string[]) {
  await loadPreset(db, actor.teamId, presetId);
  const v = await pickVersion(db, presetId, version);
  const rows = await teamFitsByIds(db, actor.teamId, fitIds);
  if (rows.length !== new Set(fitIds).size) throw unprocessable('Some of the chosen fits are not fits of this team.');
  await db.transaction(async (tx) => {
    await tx.insert(fitPresetComparisons).values(rows.map((r) => ({ fitId: r.id, presetVersionId: v.id, role: 'compared' as const }))).onConflictDoNothing();
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'preset.compare', targetType: 'preset', targetId: presetId, detail: { version: v.version, fitIds: rows.map((r) => r.id) } });
  });
  return { version: v.version, fitIds: rows.map((r) => r.id) };
}

/** Preset versions a fit went into or was compared against, newest first. */
export async function fitPresetComparisonList(db: Db, teamId: string, fitId: string): Promise<FitPresetComparison[]> {
  const [fit] = await db.select({ id: fits.id }).from(fits).where(and(eq(fits.teamId, teamId), eq(fits.id, fitId)));
  if (!fit) throw notFound('No such fit in this team.');
  const rows = await db
    .select({ presetId: designPresets.id, presetName: designPresets.name, version: presetVersions.version, role: fitPresetComparisons.role, comparedAt: fitPresetComparisons.comparedAt })
    .from(fitPresetComparisons)
    .innerJoin(presetVersions, eq(presetVersions.id, fitPresetComparisons.presetVersionId))
    .innerJoin(designPresets, eq(designPresets.id, presetVersions.presetId))
    .where(eq(fitPresetComparisons.fitId, fit.id))
    .orderBy(desc(fitPresetComparisons.comparedAt));
  return rows.map((r) => ({ ...r, comparedAt: r.comparedAt.toISOString() }));
}
