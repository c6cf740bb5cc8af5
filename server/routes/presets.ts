import type { Request, Response } from 'express';
import { and, desc, eq } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import {
  FitComparisonsParams,
  ForecastBody,
  KeepOutQuery,
  PoolPreviewBody,
  PresetCreateBody,
  PresetParams,
  PresetVersionParams,
  PresetVersionQuery,
  PublishVersionBody,
  RecordComparisonsBody,
  type FitPresetComparison,
  type ForecastResponse,
  type KeepOutResponse,
  type MeasuredVsForecastResponse,
  type MeasuredVsForecastRow,
} from '../../shared/schemas/presets';
import { keepOutDistance } from '../../shared/presets/keep-out';
import { forecastFromPreset, launchFor, type PresetValues } from '../../shared/presets/preset-forecast';
import { measuredSpeed } from '../../shared/presets/fit-values';
import { forecastShot } from '../../shared/physics/forecast';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { signedIn, teamRole } from '../auth/access';
import { fits } from '../db/schema/fits';
import { designPresets, fitPresetComparisons, presetVersions } from '../db/schema/presets';
import { currentTeam, currentUser, input } from '../http/input';
import { notFound, unprocessable } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { createPreset, poolFits, publishVersion } from '../presets/publish';
import { approvedFitsForPreset, candidateOf, loadPreset, pickVersion, presetDetail, presetList, teamFitsByIds, versionRows, versionViews, type LoadedPreset, type VersionRow } from '../presets/preset-store';

/**
 * Design presets: versioned Cd and launcher efficiency for a launcher and
 * projectile, pooled from approved fits, and the forecasts and keep-out
 * distance built on them. Versions are immutable; publishing adds one.
 */
export function presetRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/presets';
  const one = `${base}/:presetId`;
  api.get(base, 'The team’s design presets with their latest version', signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Create a preset; version 1 starts from a handbook Cd and a stated efficiency assumption', status: 201 }, signedIn, teamRole(CAN.editPresets), validate({ params: TeamParams, body: PresetCreateBody }), create);
  api.get(one, 'One preset with its launcher, projectile and every version with provenance and diffs', signedIn, teamRole(CAN.read), validate({ params: PresetParams }), getOne);
  api.get(`${one}/candidates`, 'Approved fits of the preset’s launcher and projectile, with what each would contribute', signedIn, teamRole(CAN.read), validate({ params: PresetParams }), candidates);
  api.post(`${one}/pool-preview`, 'Pool chosen approved fits without publishing: pooled values and heterogeneity', signedIn, teamRole(CAN.editPresets), validate({ params: PresetParams, body: PoolPreviewBody }), poolPreview);
  api.post(`${one}/versions`, { summary: 'Publish a new version pooled from approved fits', status: 201 }, signedIn, teamRole(CAN.editPresets), validate({ params: PresetParams, body: PublishVersionBody }), publish);
  api.get(`${one}/versions/:version`, 'One version, however old', signedIn, teamRole(CAN.read), validate({ params: PresetVersionParams }), getVersion);
  api.get(`${one}/versions/:version/diff`, 'What changed from the previous version', signedIn, teamRole(CAN.read), validate({ params: PresetVersionParams }), getDiff);
  api.post(`${one}/versions/:version/comparisons`, { summary: 'Record that approved fits were compared against this version', status: 201 }, signedIn, teamRole(CAN.review), validate({ params: PresetVersionParams, body: RecordComparisonsBody }), recordComparisons);
  api.get(`${one}/keep-out`, 'Keep-out distance: worst-case range at maximum working pressure times the safety factor, beside the vacuum ceiling', signedIn, teamRole(CAN.read), validate({ params: PresetParams, query: KeepOutQuery }), keepOut);
  api.get(`${one}/measured-vs-forecast`, 'Measured speed and tape range of the preset’s approved shots against its forecast', signedIn, teamRole(CAN.read), validate({ params: PresetParams, query: PresetVersionQuery }), measuredVsForecast);
  api.post('/api/teams/:teamId/forecast', 'Forecast a shot from a preset version and the day’s conditions', signedIn, teamRole(CAN.read), validate({ params: TeamParams, body: ForecastBody }), forecast);
  api.get('/api/teams/:teamId/fits/:fitId/preset-comparisons', 'Preset versions a fit went into or was compared against', signedIn, teamRole(CAN.read), validate({ params: FitComparisonsParams }), fitComparisons);

  const valuesOf = (v: VersionRow): PresetValues => ({
    dragCoefficient: v.dragCoefficient,
    dragCoefficientStd: v.dragCoefficientStd,
    efficiency: v.efficiency,
    efficiencyStd: v.efficiencyStd,
    launcherModel: v.launcherModel,
  });

  async function list(_req: Request, res: Response) {
    res.json(await presetList(db, currentTeam(res).id));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: PresetCreateBody });
    const team = currentTeam(res);
    const id = await createPreset(db, team.id, currentUser(res).id, body);
    res.status(201).json(await presetDetail(db, team.id, id));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetParams });
    res.json(await presetDetail(db, currentTeam(res).id, params.presetId));
  }

  async function candidates(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetParams });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, params.presetId);
    res.json((await approvedFitsForPreset(db, team.id, l)).map((f) => candidateOf(f, l)));
  }

  async function poolPreview(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetParams, body: PoolPreviewBody });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, params.presetId);
    res.json(await poolFits(db, team.id, l, body.fitIds));
  }

  async function publish(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetParams, body: PublishVersionBody });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, params.presetId);
    const version = await publishVersion(db, team.id, currentUser(res).id, l, body);
    const views = versionViews(await versionRows(db, l.preset.id));
    res.status(201).json(views.find((v) => v.version === version));
  }

  async function versionOr404(teamId: string, presetId: string, version: number) {
    await loadPreset(db, teamId, presetId);
    const views = versionViews(await versionRows(db, presetId));
    const found = views.find((v) => v.version === version);
    if (!found) throw notFound(`The preset has no version ${version}.`);
    return found;
  }

  async function getVersion(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetVersionParams });
    res.json(await versionOr404(currentTeam(res).id, params.presetId, params.version));
  }

  async function getDiff(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetVersionParams });
    res.json((await versionOr404(currentTeam(res).id, params.presetId, params.version)).diff);
  }

  async function recordComparisons(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetVersionParams, body: RecordComparisonsBody });
    const team = currentTeam(res);
    await loadPreset(db, team.id, params.presetId);
    const v = await pickVersion(db, params.presetId, params.version);
    const rows = await teamFitsByIds(db, team.id, body.fitIds);
    if (rows.length !== new Set(body.fitIds).size) throw unprocessable('Some of the chosen fits are not fits of this team.');
    await db.transaction(async (tx) => {
      await tx.insert(fitPresetComparisons).values(rows.map((r) => ({ fitId: r.id, presetVersionId: v.id, role: 'compared' as const }))).onConflictDoNothing();
      await audit(tx, { teamId: team.id, actorUserId: currentUser(res).id, action: 'preset.compare', targetType: 'preset', targetId: params.presetId, detail: { version: v.version, fitIds: rows.map((r) => r.id) } });
    });
    res.status(201).json({ version: v.version, fitIds: rows.map((r) => r.id) });
  }

  async function forecast(_req: Request, res: Response) {
    const { body } = input(res, { body: ForecastBody });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, body.presetId);
    const v = await pickVersion(db, l.preset.id, body.version);
    const result = forecastFromPreset({ values: valuesOf(v), launcher: l.launcher, projectile: l.projectile, conditions: body });
    const cautions = [...result.cautions];
    if (body.pressurePa < l.preset.pressureMinPa || body.pressurePa > l.preset.pressureMaxPa) {
      cautions.unshift(`The pressure is outside the preset’s range (${l.preset.pressureMinPa}–${l.preset.pressureMaxPa} Pa); its values were not established there.`);
    }
    if (l.launcher.maxWorkingPressurePa !== null && body.pressurePa > l.launcher.maxWorkingPressurePa) {
      cautions.unshift(`The pressure is above the launcher’s maximum working pressure (${l.launcher.maxWorkingPressurePa} Pa). Do not charge the launcher to it.`);
    }
    const response: ForecastResponse = {
      preset: { id: l.preset.id, name: l.preset.name },
      version: { version: v.version, ...valuesOf(v) },
      inputs: body,
      ...result,
      cautions,
    };
    res.json(response);
  }

  async function keepOut(_req: Request, res: Response) {
    const { params, query } = input(res, { params: PresetParams, query: KeepOutQuery });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, params.presetId);
    const v = await pickVersion(db, l.preset.id, query.version);
    const maxWorkingPressurePa = l.launcher.maxWorkingPressurePa;
    if (maxWorkingPressurePa === null) {
      throw unprocessable(`The launcher “${l.launcher.name}” has no maximum working pressure on record, so no keep-out distance can be computed. Add the rated pressure of its vessel first.`);
    }
    const result = keepOutDistance({
      values: valuesOf(v),
      safetyFactor: v.keepOutSafetyFactor,
      launcher: { ...l.launcher, maxWorkingPressurePa },
      projectile: l.projectile,
      air: query,
    });
    const response: KeepOutResponse = { presetId: l.preset.id, version: v.version, ...result };
    res.json(response);
  }

  async function measuredVsForecast(_req: Request, res: Response) {
    const { params, query } = input(res, { params: PresetParams, query: PresetVersionQuery });
    const team = currentTeam(res);
    const l = await loadPreset(db, team.id, params.presetId);
    const v = await pickVersion(db, l.preset.id, query.version);
    const rows = (await approvedFitsForPreset(db, team.id, l)).map((f) => comparisonRow(f, l, valuesOf(v)));
    const response: MeasuredVsForecastResponse = { presetId: l.preset.id, version: v.version, rows };
    res.json(response);
  }

  async function fitComparisons(_req: Request, res: Response) {
    const { params } = input(res, { params: FitComparisonsParams });
    const team = currentTeam(res);
    const [fit] = await db.select({ id: fits.id }).from(fits).where(and(eq(fits.teamId, team.id), eq(fits.id, params.fitId)));
    if (!fit) throw notFound('No such fit in this team.');
    const rows = await db
      .select({ presetId: designPresets.id, presetName: designPresets.name, version: presetVersions.version, role: fitPresetComparisons.role, comparedAt: fitPresetComparisons.comparedAt })
      .from(fitPresetComparisons)
      .innerJoin(presetVersions, eq(presetVersions.id, fitPresetComparisons.presetVersionId))
      .innerJoin(designPresets, eq(designPresets.id, presetVersions.presetId))
      .where(eq(fitPresetComparisons.fitId, fit.id))
      .orderBy(desc(fitPresetComparisons.comparedAt));
    const out: FitPresetComparison[] = rows.map((r) => ({ ...r, comparedAt: r.comparedAt.toISOString() }));
    res.json(out);
  }
}

/** One shot's measurements beside the preset's forecast at that shot's own pressure, elevation and air. */
function comparisonRow(f: Awaited<ReturnType<typeof approvedFitsForPreset>>[number], l: LoadedPreset, values: PresetValues): MeasuredVsForecastRow {
  const speed = measuredSpeed(f.result);
  const row: MeasuredVsForecastRow = {
    fitId: f.id,
    shotId: f.shotId,
    shotLabel: f.shotLabel,
    chamberPressurePa: f.chamberPressurePa,
    elevationDeg: f.elevationDeg,
    measuredSpeedMps: speed.value,
    measuredSpeedStdErr: speed.stdErr,
    measuredFrom: speed.from,
    forecastSpeedMps: null,
    tapeRangeM: f.tapeRangeM,
    forecastRangeM: null,
    note: null,
  };
  if (f.chamberPressurePa === null) return { ...row, note: 'the shot has no chamber pressure, so nothing can be forecast for it' };
  const conditions = {
    pressurePa: f.chamberPressurePa,
    elevationDeg: f.elevationDeg ?? f.result.launchAngleDeg.value,
    airTempC: f.airTempC ?? 15,
    stationPressurePa: f.stationPressurePa ?? 101325,
    relativeHumidityPct: f.relativeHumidityPct ?? 50,
    targetHeightM: 0,
    windMps: 0,
  };
  const launch = launchFor({ values, launcher: l.launcher, projectile: l.projectile, conditions }, values.dragCoefficient, values.efficiency);
  const range = forecastShot({ speedMps: launch.speedMps, angleDeg: conditions.elevationDeg, dragK_perM: launch.dragK_perM }).rangeM;
  const notes = [];
  if (f.elevationDeg === null) notes.push('elevation not recorded: the fitted launch angle is used');
  if (f.airTempC === null || f.stationPressurePa === null) notes.push('conditions not recorded: 15 °C and 101325 Pa assumed');
  return { ...row, forecastSpeedMps: launch.speedMps, forecastRangeM: range, note: notes.length ? notes.join('; ') : null };
}
