// Reading presets, their versions and the fits they may pool, shaped for the API.
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { FitCandidate, PresetDetail, PresetSummary, PresetVersion } from '../../shared/schemas/presets';
import { fitContribution } from '../../shared/presets/fit-values';
import { launcherModelFor } from '../../shared/presets/launcher-speed';
import { diffVersions } from '../../shared/presets/version-diff';
import type { Db, DbOrTx } from '../db/client';
import { fits } from '../db/schema/fits';
import { designPresets, presetVersions } from '../db/schema/presets';
import { launchers, projectiles, shots } from '../db/schema/records';
import { users } from '../db/schema/users';
import { notFound } from '../http/problem';

export type PresetRow = typeof designPresets.$inferSelect;
export type VersionRow = typeof presetVersions.$inferSelect;
export type LauncherRow = typeof launchers.$inferSelect;
export type ProjectileRow = typeof projectiles.$inferSelect;

export interface LoadedPreset {
  preset: PresetRow;
  launcher: LauncherRow;
  projectile: ProjectileRow;
}

export async function loadPreset(db: Db, teamId: string, presetId: string): Promise<LoadedPreset> {
  const [row] = await db
    .select({ preset: designPresets, launcher: launchers, projectile: projectiles })
    .from(designPresets)
    .innerJoin(launchers, eq(launchers.id, designPresets.launcherId))
    .innerJoin(projectiles, eq(projectiles.id, designPresets.projectileId))
    .where(and(eq(designPresets.teamId, teamId), eq(designPresets.id, presetId)));
  if (!row) throw notFound('No such preset in this team.');
  return row;
}

export async function versionRows(db: Db, presetId: string): Promise<(VersionRow & { publisherName: string | null })[]> {
  const rows = await db
    .select({ v: presetVersions, publisherName: users.displayName })
    .from(presetVersions)
    .leftJoin(users, eq(users.id, presetVersions.publishedBy))
    .where(eq(presetVersions.presetId, presetId))
    .orderBy(asc(presetVersions.version));
  return rows.map((r) => ({ ...r.v, publisherName: r.publisherName }));
}

/** A version as the API shows it, with its diff against the version before it. */
export function versionView(row: VersionRow & { publisherName: string | null }, previous: VersionRow | null): PresetVersion {
  return {
    id: row.id,
    version: row.version,
    dragCoefficient: row.dragCoefficient,
    dragCoefficientStd: row.dragCoefficientStd,
    efficiency: row.efficiency,
    efficiencyStd: row.efficiencyStd,
    launcherModel: row.launcherModel,
    dragSource: row.dragSource,
    efficiencySource: row.efficiencySource,
    pooledFitIds: row.pooledFitIds,
    heterogeneity: row.heterogeneity ?? null,
    keepOutSafetyFactor: row.keepOutSafetyFactor,
    note: row.note,
    publishedBy: row.publishedBy ? { id: row.publishedBy, displayName: row.publisherName ?? 'former member' } : null,
    publishedAt: row.publishedAt.toISOString(),
    diff: diffVersions(previous, row),
  };
}

export function versionViews(rows: (VersionRow & { publisherName: string | null })[]): PresetVersion[] {
  return rows.map((row, i) => versionView(row, i > 0 ? rows[i - 1] : null));
}

function summaryOf(l: LoadedPreset, versions: PresetVersion[]): PresetSummary {
  const latest = versions.at(-1);
  const { diff: _diff, ...latestWithoutDiff } = latest ?? ({} as PresetVersion);
  return {
    id: l.preset.id,
    name: l.preset.name,
    launcher: { id: l.launcher.id, name: l.launcher.name },
    projectile: { id: l.projectile.id, name: l.projectile.name },
    pressureMinPa: l.preset.pressureMinPa,
    pressureMaxPa: l.preset.pressureMaxPa,
    createdAt: l.preset.createdAt.toISOString(),
    latest: latest ? latestWithoutDiff : null,
    versionCount: versions.length,
  };
}

export async function presetDetail(db: Db, teamId: string, presetId: string): Promise<PresetDetail> {
  const l = await loadPreset(db, teamId, presetId);
  const versions = versionViews(await versionRows(db, presetId));
  return {
    ...summaryOf(l, versions),
    launcherRecord: {
      boreM: l.launcher.boreM,
      barrelLengthM: l.launcher.barrelLengthM,
      chamberVolumeM3: l.launcher.chamberVolumeM3,
      maxWorkingPressurePa: l.launcher.maxWorkingPressurePa,
      valveType: l.launcher.valveType,
    },
    projectileRecord: { massKg: l.projectile.massKg, diameterM: l.projectile.diameterM, shape: l.projectile.shape, referenceAreaM2: l.projectile.referenceAreaM2 },
    versions,
  };
}

export async function presetList(db: Db, teamId: string): Promise<PresetSummary[]> {
  const rows = await db
    .select({ preset: designPresets, launcher: launchers, projectile: projectiles })
    .from(designPresets)
    .innerJoin(launchers, eq(launchers.id, designPresets.launcherId))
    .innerJoin(projectiles, eq(projectiles.id, designPresets.projectileId))
    .where(eq(designPresets.teamId, teamId))
    .orderBy(asc(designPresets.name));
  const out: PresetSummary[] = [];
  for (const l of rows) out.push(summaryOf(l, versionViews(await versionRows(db, l.preset.id))));
  return out;
}

/** One version by number, or the latest when none is asked for. */
export async function pickVersion(db: DbOrTx, presetId: string, version?: number): Promise<VersionRow> {
  const [row] = version
    ? await db.select().from(presetVersions).where(and(eq(presetVersions.presetId, presetId), eq(presetVersions.version, version)))
    : await db.select().from(presetVersions).where(eq(presetVersions.presetId, presetId)).orderBy(desc(presetVersions.version)).limit(1);
  if (!row) throw notFound(version ? `The preset has no version ${version}.` : 'The preset has no version yet.');
  return row;
}

export interface ApprovedFitRow {
  id: string;
  state: string;
  shotId: string;
  shotLabel: string;
  launcherId: string | null;
  projectileId: string | null;
  chamberPressurePa: number | null;
  elevationDeg: number | null;
  airTempC: number | null;
  stationPressurePa: number | null;
  relativeHumidityPct: number | null;
  tapeRangeM: number | null;
  reviewedAt: Date | null;
  result: typeof fits.$inferSelect.result;
}

const fitColumns = {
  id: fits.id,
  state: fits.state,
  shotId: shots.id,
  shotLabel: shots.label,
  launcherId: shots.launcherId,
  projectileId: shots.projectileId,
  chamberPressurePa: shots.chamberPressurePa,
  elevationDeg: shots.elevationDeg,
  airTempC: shots.airTempC,
  stationPressurePa: shots.stationPressurePa,
  relativeHumidityPct: shots.relativeHumidityPct,
  tapeRangeM: shots.tapeRangeM,
  reviewedAt: fits.reviewedAt,
  result: fits.result,
};

/** Approved fits of shots fired with this preset's launcher and projectile. */
export async function approvedFitsForPreset(db: Db, teamId: string, l: LoadedPreset): Promise<ApprovedFitRow[]> {
  return db
    .select(fitColumns)
    .from(fits)
    .innerJoin(shots, eq(shots.id, fits.shotId))
    .where(and(eq(fits.teamId, teamId), eq(fits.state, 'approved'), eq(shots.launcherId, l.launcher.id), eq(shots.projectileId, l.projectile.id)))
    .orderBy(asc(fits.reviewedAt), asc(fits.id));
}

/** The named fits of this team, whatever their state, for the publish checks. */
export async function teamFitsByIds(db: Db, teamId: string, ids: string[]): Promise<ApprovedFitRow[]> {
  return db.select(fitColumns).from(fits).innerJoin(shots, eq(shots.id, fits.shotId)).where(and(eq(fits.teamId, teamId), inArray(fits.id, ids)));
}

export function candidateOf(fit: ApprovedFitRow, l: LoadedPreset): FitCandidate {
  const c = fitContribution(
    { fitId: fit.id, result: fit.result, chamberPressurePa: fit.chamberPressurePa, stationPressurePa: fit.stationPressurePa, massKg: l.projectile.massKg },
    launcherModelFor(l.launcher),
    l.launcher,
  );
  return {
    fitId: fit.id,
    shotId: fit.shotId,
    shotLabel: fit.shotLabel,
    reviewedAt: fit.reviewedAt?.toISOString() ?? null,
    chamberPressurePa: fit.chamberPressurePa,
    dragCoefficient: c.dragCoefficient,
    efficiency: c.efficiency,
    notes: c.notes,
    usable: c.dragCoefficient !== null,
  };
}
