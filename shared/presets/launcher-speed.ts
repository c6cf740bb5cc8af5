// The launcher model a preset uses, and the muzzle speed it forecasts:
// model speed × √efficiency, since the efficiency is a share of kinetic energy.
import { adiabaticSpeed, constantPressureSpeedMps } from '../physics/launcher';
import type { PresetLauncherModel } from '../schemas/presets';

export interface LauncherGeometry {
  boreM: number | null;
  barrelLengthM: number | null;
  chamberVolumeM3: number | null;
}

/** What is missing from the launcher record for a model speed, in words; empty when nothing is. */
export function missingGeometry(l: LauncherGeometry): string[] {
  const out: string[] = [];
  if (l.boreM === null) out.push('launcher bore');
  if (l.barrelLengthM === null) out.push('launcher barrel length');
  return out;
}

/** The finite-reservoir model when the chamber volume is known (closer to real launchers), else the constant-pressure bound. */
export function launcherModelFor(l: LauncherGeometry): PresetLauncherModel {
  return l.chamberVolumeM3 !== null ? 'adiabatic' : 'constant-pressure';
}

export function modelSpeedMps(model: PresetLauncherModel, l: LauncherGeometry, gaugePressurePa: number, massKg: number, atmosphericPressurePa?: number): number {
  if (l.boreM === null || l.barrelLengthM === null) throw new Error(`the launcher model needs ${missingGeometry(l).join(' and ')}`);
  const base = { gaugePressurePa, boreDiameterM: l.boreM, barrelLengthM: l.barrelLengthM, massKg };
  if (model === 'adiabatic') {
    if (l.chamberVolumeM3 === null) throw new Error('the adiabatic model needs the launcher chamber volume');
    return adiabaticSpeed({ ...base, chamberVolumeM3: l.chamberVolumeM3, atmosphericPressurePa }).speedMps;
  }
  return constantPressureSpeedMps(base);
}

export function muzzleSpeedFromEfficiency(modelSpeed: number, efficiency: number): number {
  return modelSpeed * Math.sqrt(Math.max(0, efficiency));
}
