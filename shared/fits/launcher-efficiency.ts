// Measured speed against the two launcher models of shared/physics, for the
// launcher and chamber pressure the shot was recorded with.
import { adiabaticSpeed, constantPressureSpeedMps, launcherEfficiency } from '../physics/launcher';
import type { FitShotResult } from '../physics/types';
import type { FitInputSnapshot } from './snapshot';

export interface LauncherModelRow {
  model: 'constant-pressure' | 'adiabatic';
  label: string;
  modelSpeedMps: number | null;
  efficiency: number | null;
  note: string | null;
}

export interface LauncherComparison {
  /** The speed compared: the muzzle speed when a muzzle was marked, else the launch speed at the first mark. */
  measuredSpeedMps: number;
  measuredFrom: 'muzzle' | 'first mark';
  rows: LauncherModelRow[];
  /** Why nothing could be computed, when the records lack a needed number. */
  missing: string[];
}

export function compareWithLauncherModels(result: FitShotResult, snapshot: FitInputSnapshot): LauncherComparison {
  const measuredFrom = result.muzzle ? 'muzzle' : 'first mark';
  const measured = result.muzzle ? result.muzzle.speedMps.value : result.launchSpeedMps.value;
  const l = snapshot.launcher;
  const pressure = snapshot.shot.chamberPressurePa;
  const missing: string[] = [];
  if (!l) missing.push('the shot has no launcher');
  if (l && l.boreM === null) missing.push('launcher bore');
  if (l && l.barrelLengthM === null) missing.push('launcher barrel length');
  if (pressure === null) missing.push('shot chamber pressure');
  if (missing.length > 0 || !l || pressure === null) {
    return { measuredSpeedMps: measured, measuredFrom, rows: [], missing };
  }
  const base = { gaugePressurePa: pressure, boreDiameterM: l.boreM!, barrelLengthM: l.barrelLengthM!, massKg: snapshot.projectile.massKg };
  const constant = constantPressureSpeedMps(base);
  const rows: LauncherModelRow[] = [
    {
      model: 'constant-pressure',
      label: 'Constant pressure along the barrel (upper bound)',
      modelSpeedMps: constant,
      efficiency: constant > 0 ? launcherEfficiency(measured, constant) : null,
      note: null,
    },
  ];
  if (l.chamberVolumeM3 === null) {
    rows.push({ model: 'adiabatic', label: 'Adiabatic expansion of the chamber', modelSpeedMps: null, efficiency: null, note: 'needs the launcher chamber volume' });
  } else {
    const a = adiabaticSpeed({ ...base, chamberVolumeM3: l.chamberVolumeM3, atmosphericPressurePa: snapshot.shot.stationPressurePa ?? undefined });
    rows.push({
      model: 'adiabatic',
      label: 'Adiabatic expansion of the chamber',
      modelSpeedMps: a.speedMps,
      efficiency: a.speedMps > 0 ? launcherEfficiency(measured, a.speedMps) : null,
      note: a.underExpanded ? 'gas falls below atmospheric before the muzzle: a shorter barrel would do better' : null,
    });
  }
  return { measuredSpeedMps: measured, measuredFrom, rows, missing };
}
