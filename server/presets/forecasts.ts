import type { z } from 'zod';
import { formatPressureKPa } from '../../shared/fits/format';
import { forecastShot } from '../../shared/physics/forecast';
import { measuredSpeed } from '../../shared/presets/fit-values';
import { keepOutDistance } from '../../shared/presets/keep-out';
import { forecastFromPreset, launchFor, type PresetValues } from '../../shared/presets/preset-forecast';
import type {
  ForecastBody,
  ForecastResponse,
  KeepOutQuery,
  KeepOutResponse,
  MeasuredVsForecastResponse,
  MeasuredVsForecastRow,
} from '../../shared/schemas/presets';
import type { Db } from '../db/client';
import { unprocessable } from '../http/problem';
import { approvedFitsForPreset, loadPreset, pickVersion, type LoadedPreset, type VersionRow } from './preset-store';

// What a preset version predicts: a shot on the day, the keep-out distance, and
// how its forecasts compare with the approved shots it was built from.

const valuesOf = (v: VersionRow): PresetValues => ({
  dragCoefficient: v.dragCoefficient,
  dragCoefficientStd: v.dragCoefficientStd,
  efficiency: v.efficiency,
  efficiencyStd: v.efficiencyStd,
  launcherModel: v.launcherModel,
});

/** Forecasts a shot from a preset version and the day's conditions, with cautions for pressures outside what is known or safe. */
export async function forecastFromVersion(db: Db, teamId: string, body: z.output<typeof ForecastBody>): Promise<ForecastResponse> {
  const l = await loadPreset(db, teamId, body.presetId);
  const v = await pickVersion(db, l.preset.id, body.version);
  const result = forecastFromPreset({ values: valuesOf(v), launcher: l.launcher, projectile: l.projectile, conditions: body });
  const cautions = [...result.cautions];
  if (body.pressurePa < l.preset.pressureMinPa || body.pressurePa > l.preset.pressureMaxPa) {
    cautions.unshift(`The pressure is outside the preset’s range (${formatPressureKPa(l.preset.pressureMinPa, { withUnit: false })}–${formatPressureKPa(l.preset.pressureMaxPa)}); its values were not established there.`);
  }
  if (l.launcher.maxWorkingPressurePa !== null && body.pressurePa > l.launcher.maxWorkingPressurePa) {
    cautions.unshift(`The pressure is above the launcher’s maximum working pressure (${formatPressureKPa(l.launcher.maxWorkingPressurePa)}). Do not charge the launcher to it.`);
  }
  return {
    preset: { id: l.preset.id, name: l.preset.name },
    version: { version: v.version, ...valuesOf(v) },
    inputs: body,
    ...result,
    cautions,
  };
}

/** Keep-out distance: worst-case range at maximum working pressure times the version's safety factor. */
export async function presetKeepOut(db: Db, teamId: string, presetId: string, query: z.output<typeof KeepOutQuery>): Promise<KeepOutResponse> {
  const l = await loadPreset(db, teamId, presetId);
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
  return { presetId: l.preset.id, version: v.version, ...result };
}

/** Measured speed and tape range of the preset's approved shots against its forecast. */
export async function measuredVsForecast(db: Db, teamId: string, presetId: string, version?: number): Promise<MeasuredVsForecastResponse> {
  const l = await loadPreset(db, teamId, presetId);
  const v = await pickVersion(db, l.preset.id, version);
  const rows = (await approvedFitsForPreset(db, teamId, l)).map((f) => comparisonRow(f, l, valuesOf(v)));
  return { presetId: l.preset.id, version: v.version, rows };
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
