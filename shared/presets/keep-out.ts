// Keep-out distance: how far the preset's projectile could possibly go from
// this launcher, for planning where people may stand. The worst case is built
// from the top of the speed interval and the bottom of the drag interval, at
// the launcher's maximum working pressure and the elevation that carries
// furthest, then multiplied by the team's safety factor.
import { STANDARD_GRAVITY_MPS2 } from '../physics/constants';
import { dragKFromCd } from '../physics/flight';
import { bestElevationForRange } from '../physics/forecast';
import type { KeepOutResponse } from '../schemas/presets';
import { modelSpeedMps, muzzleSpeedFromEfficiency, type LauncherGeometry } from './launcher-speed';
import { airDensityFor, type PresetValues } from './preset-forecast';

export const KEEP_OUT_CAUTIONS = [
  'This is an estimate for planning, not a substitute for range-safety rules, local codes or licensed practice.',
  'Pressure vessels must be rated and inspected; never charge a launcher above its maximum working pressure.',
  'Ricochets, wind gusts, a burst line or a failed valve can carry a projectile outside any forecast; keep the downrange area clear and controlled.',
];

/** Two standard uncertainties: roughly a 95 % one-sided bound for a normal distribution (common practice). */
export const BOUND_SIGMAS = 2;

export interface KeepOutSetup {
  values: PresetValues;
  safetyFactor: number;
  launcher: LauncherGeometry & { maxWorkingPressurePa: number };
  projectile: { massKg: number; diameterM: number };
  air: { airTempC: number; stationPressurePa: number; relativeHumidityPct: number };
}

export function keepOutDistance(s: KeepOutSetup): Omit<KeepOutResponse, 'presetId' | 'version'> {
  const { values: v } = s;
  const air = airDensityFor(s.air);
  const model = modelSpeedMps(v.launcherModel, s.launcher, s.launcher.maxWorkingPressurePa, s.projectile.massKg, s.air.stationPressurePa);
  // Upper-bound efficiency cannot exceed 1: the model is already the loss-free bound.
  const efficiencyUpper = Math.min(1, v.efficiency + BOUND_SIGMAS * v.efficiencyStd);
  // Lower-bound Cd kept above zero (a tenth of the value), since zero drag is the vacuum ceiling shown beside it.
  const dragCoefficientLower = Math.max(0.1 * v.dragCoefficient, v.dragCoefficient - BOUND_SIGMAS * v.dragCoefficientStd);
  const speedUpperMps = muzzleSpeedFromEfficiency(model, efficiencyUpper);
  const best = bestElevationForRange({ speedMps: speedUpperMps, dragK_perM: dragKFromCd(dragCoefficientLower, s.projectile.diameterM, s.projectile.massKg, air.densityKgM3) });
  const g = STANDARD_GRAVITY_MPS2;
  return {
    maxWorkingPressurePa: s.launcher.maxWorkingPressurePa,
    modelSpeedMps: model,
    efficiencyUpper,
    speedUpperMps,
    dragCoefficientLower,
    air,
    bestElevationDeg: best.angleDeg,
    maxRangeM: best.rangeM,
    safetyFactor: s.safetyFactor,
    keepOutM: best.rangeM * s.safetyFactor,
    vacuumCeilingM: (model * model) / g,
    vacuumAtUpperSpeedM: (speedUpperMps * speedUpperMps) / g,
    method:
      `Largest range over all elevations (golden-section search) on level ground at the maximum working pressure, ` +
      `with efficiency + ${BOUND_SIGMAS}σ (capped at 1, the model bound) and Cd − ${BOUND_SIGMAS}σ (kept above zero), ` +
      `in thin air (${air.source}), times the safety factor. The vacuum ceiling v²/g uses the model speed with no losses and no drag.`,
    cautions: KEEP_OUT_CAUTIONS,
  };
}
