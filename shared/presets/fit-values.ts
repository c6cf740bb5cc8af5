// What one approved fit contributes to a preset: its drag coefficient with the
// fit's standard error, and the launcher efficiency implied by its measured
// speed against the preset's launcher model at the shot's pressure.
import type { FitShotResult } from '../physics/types';
import { launcherEfficiency } from '../physics/launcher';
import type { PresetLauncherModel } from '../schemas/presets';
import { missingGeometry, modelSpeedMps, type LauncherGeometry } from './launcher-speed';

export interface FitForPreset {
  fitId: string;
  result: FitShotResult;
  chamberPressurePa: number | null;
  stationPressurePa: number | null;
  massKg: number;
}

export interface FitContribution {
  dragCoefficient: { value: number; stdErr: number } | null;
  efficiency: { value: number; stdErr: number; measuredSpeedMps: number; modelSpeedMps: number } | null;
  measuredSpeedMps: number;
  measuredSpeedStdErr: number;
  measuredFrom: 'muzzle' | 'first mark';
  notes: string[];
}

/** The muzzle speed when the muzzle was marked (what the launcher delivered), else the speed at the first mark. */
export function measuredSpeed(result: FitShotResult): { value: number; stdErr: number; from: 'muzzle' | 'first mark' } {
  if (result.muzzle) return { value: result.muzzle.speedMps.value, stdErr: result.muzzle.speedMps.stdErr, from: 'muzzle' };
  return { value: result.launchSpeedMps.value, stdErr: result.launchSpeedMps.stdErr, from: 'first mark' };
}

export function fitContribution(fit: FitForPreset, model: PresetLauncherModel, launcher: LauncherGeometry): FitContribution {
  const notes: string[] = [];
  const cd = fit.result.dragCoefficient;
  let dragCoefficient: FitContribution['dragCoefficient'] = null;
  if (!fit.result.dragResolved) notes.push('drag was not resolved by this fit');
  else if (!Number.isFinite(cd.value) || !(cd.stdErr > 0) || !Number.isFinite(cd.stdErr)) notes.push('the fit has no finite drag coefficient uncertainty');
  else dragCoefficient = { value: cd.value, stdErr: cd.stdErr };

  const speed = measuredSpeed(fit.result);
  let efficiency: FitContribution['efficiency'] = null;
  const missing = missingGeometry(launcher);
  if (fit.chamberPressurePa === null) missing.push('shot chamber pressure');
  if (model === 'adiabatic' && launcher.chamberVolumeM3 === null) missing.push('launcher chamber volume');
  if (missing.length > 0) notes.push(`no efficiency: needs ${missing.join(', ')}`);
  else if (speed.stdErr > 0 && Number.isFinite(speed.stdErr)) {
    const model_ = modelSpeedMps(model, launcher, fit.chamberPressurePa!, fit.massKg, fit.stationPressurePa ?? undefined);
    if (model_ > 0) {
      const eta = launcherEfficiency(speed.value, model_);
      // η = (v/v_m)², so σ_η = 2 η σ_v / v (first order; the model speed is taken as exact).
      efficiency = { value: eta, stdErr: (2 * eta * speed.stdErr) / speed.value, measuredSpeedMps: speed.value, modelSpeedMps: model_ };
    } else notes.push('the launcher model gives no speed at this pressure');
  } else notes.push('the measured speed has no finite uncertainty');
  return { dragCoefficient, efficiency, measuredSpeedMps: speed.value, measuredSpeedStdErr: speed.stdErr, measuredFrom: speed.from, notes };
}
