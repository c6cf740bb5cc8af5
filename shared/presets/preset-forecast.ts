// Forecasts from a preset version: the launcher model scaled by the preset's
// efficiency gives the muzzle speed; the preset's Cd and the day's air give the
// drag constant; the physics core does the flying. Pure, so the server, the
// tests and any future offline tool get the same numbers.
import { quantileSorted } from 'simple-statistics';
import { humidAirDensityKgM3 } from '../physics/air';
import { STANDARD_GRAVITY_MPS2 } from '../physics/constants';
import { dragKFromCd, simulateTrajectory } from '../physics/flight';
import { bestElevationForRange, forecastShot, vacuumForecast } from '../physics/forecast';
import type { Band, ForecastResponse, PresetLauncherModel, SweepRow } from '../schemas/presets';
import { modelSpeedMps, muzzleSpeedFromEfficiency, type LauncherGeometry } from './launcher-speed';
import { mulberry32, normalDeviates } from '../random/prng';
import { formatPressureKPa } from '../fits/format';

export interface PresetValues {
  dragCoefficient: number;
  dragCoefficientStd: number;
  efficiency: number;
  efficiencyStd: number;
  launcherModel: PresetLauncherModel;
}

export interface ForecastConditions {
  pressurePa: number;
  elevationDeg: number;
  airTempC: number;
  stationPressurePa: number;
  relativeHumidityPct: number;
  targetHeightM: number;
  windMps: number;
}

export interface ForecastSetup {
  values: PresetValues;
  launcher: LauncherGeometry;
  projectile: { massKg: number; diameterM: number };
  conditions: ForecastConditions;
}

const DEG = Math.PI / 180;
export const MONTE_CARLO_SAMPLES = 400;
export const MONTE_CARLO_SEED = 20260418;
export const SWEEP_ELEVATIONS_DEG = Array.from({ length: 16 }, (_, i) => 5 + 5 * i);

export function airDensityFor(c: Pick<ForecastConditions, 'airTempC' | 'stationPressurePa' | 'relativeHumidityPct'>) {
  const densityKgM3 = humidAirDensityKgM3({ temperatureC: c.airTempC, pressurePa: c.stationPressurePa, relativeHumidity: c.relativeHumidityPct / 100 });
  return { densityKgM3, source: `humid air (Buck 1981 vapour pressure) at ${c.airTempC} °C, ${formatPressureKPa(c.stationPressurePa)}, ${c.relativeHumidityPct} %RH` };
}

/** The launch state and drag constant for one (Cd, efficiency) pair. */
export function launchFor(setup: ForecastSetup, dragCoefficient: number, efficiency: number) {
  const { conditions: c, projectile: p } = setup;
  const air = airDensityFor(c);
  const model = modelSpeedMps(setup.values.launcherModel, setup.launcher, c.pressurePa, p.massKg, c.stationPressurePa);
  return {
    air,
    modelSpeedMps: model,
    speedMps: muzzleSpeedFromEfficiency(model, efficiency),
    dragK_perM: dragKFromCd(dragCoefficient, p.diameterM, p.massKg, air.densityKgM3),
  };
}

function band(values: number[]): Band {
  const sorted = [...values].sort((a, b) => a - b);
  return { low: quantileSorted(sorted, 0.025), median: quantileSorted(sorted, 0.5), high: quantileSorted(sorted, 0.975) };
}

/** Cd drawn from its normal interval, kept positive; efficiency drawn and kept inside (0, 1], the model bound. */
function drawValues(values: PresetValues, normal: () => number) {
  const cd = Math.max(values.dragCoefficient * 0.05, values.dragCoefficient + values.dragCoefficientStd * normal());
  const eta = Math.min(1, Math.max(0.01, values.efficiency + values.efficiencyStd * normal()));
  return { cd, eta };
}

export function forecastFromPreset(setup: ForecastSetup, samples = MONTE_CARLO_SAMPLES, seed = MONTE_CARLO_SEED): Omit<ForecastResponse, 'preset' | 'version' | 'inputs'> {
  const { values, conditions: c } = setup;
  const nominal = launchFor(setup, values.dragCoefficient, values.efficiency);
  const shot = { speedMps: nominal.speedMps, dragK_perM: nominal.dragK_perM, targetHeightM: c.targetHeightM, windXMps: c.windMps };
  const withDrag = forecastShot({ ...shot, angleDeg: c.elevationDeg });
  const vacuum = vacuumForecast({ ...shot, angleDeg: c.elevationDeg });
  const best = bestElevationForRange(shot);
  const vacuumBest = vacuumForecast({ ...shot, angleDeg: 45 });

  const cautions: string[] = [];
  if (!withDrag.reachesTarget) cautions.push('The shot does not come down through the target height at this elevation.');

  const sweep: SweepRow[] = SWEEP_ELEVATIONS_DEG.map((deg) => {
    const f = forecastShot({ ...shot, angleDeg: deg });
    return {
      elevationDeg: deg,
      rangeM: f.rangeM,
      apexHeightM: f.apexHeightM,
      timeOfFlightS: f.timeOfFlightS,
      impactSpeedMps: f.impactSpeedMps,
      vacuumRangeM: vacuumForecast({ ...shot, angleDeg: deg }).rangeM,
    };
  });

  const normal = normalDeviates(mulberry32(seed));
  const speeds: number[] = [], ranges: number[] = [], apexes: number[] = [], tofs: number[] = [];
  for (let i = 0; i < samples; i++) {
    const { cd, eta } = drawValues(values, normal);
    const l = launchFor(setup, cd, eta);
    const f = forecastShot({ speedMps: l.speedMps, dragK_perM: l.dragK_perM, targetHeightM: c.targetHeightM, windXMps: c.windMps, angleDeg: c.elevationDeg });
    speeds.push(l.speedMps);
    apexes.push(f.apexHeightM);
    if (f.rangeM !== null) ranges.push(f.rangeM);
    if (f.timeOfFlightS !== null) tofs.push(f.timeOfFlightS);
  }

  return {
    air: nominal.air,
    modelSpeedMps: nominal.modelSpeedMps,
    muzzleSpeedMps: nominal.speedMps,
    dragK_perM: nominal.dragK_perM,
    withDrag: {
      reachesTarget: withDrag.reachesTarget,
      rangeM: withDrag.rangeM,
      apexHeightM: withDrag.apexHeightM,
      timeOfFlightS: withDrag.timeOfFlightS,
      impactSpeedMps: withDrag.impactSpeedMps,
      impactAngleDeg: withDrag.impactAngleDeg,
    },
    vacuum: { rangeM: vacuum.rangeM, apexHeightM: vacuum.apexHeightM, timeOfFlightS: vacuum.timeOfFlightS },
    bestElevation: { angleDeg: best.angleDeg, rangeM: best.rangeM, vacuumAngleDeg: 45, vacuumRangeM: vacuumBest.levelRangeM },
    trajectories: {
      drag: sampledPath(nominal.speedMps, c.elevationDeg, nominal.dragK_perM, c.windMps, c.targetHeightM),
      vacuum: sampledPath(nominal.speedMps, c.elevationDeg, 0, 0, c.targetHeightM),
    },
    sweep,
    band: {
      method: `Monte Carlo: ${samples} draws of Cd and efficiency from independent normal distributions with the preset's standard uncertainties (Cd kept positive, efficiency kept within (0, 1]), seeded PRNG (mulberry32, seed ${seed}); 2.5th–97.5th percentiles.`,
      samples,
      seed,
      muzzleSpeedMps: band(speeds),
      rangeM: ranges.length === samples ? band(ranges) : null,
      apexHeightM: band(apexes),
      timeOfFlightS: tofs.length === samples ? band(tofs) : null,
    },
    cautions,
  };
}

/** About 80 points from launch to the landing plane, for the chart. */
function sampledPath(speedMps: number, elevationDeg: number, dragK_perM: number, windMps: number, targetHeightM: number) {
  const launch = { xM: 0, yM: 0, vxMps: speedMps * Math.cos(elevationDeg * DEG), vyMps: speedMps * Math.sin(elevationDeg * DEG) };
  // Stop at the landing plane only when the shot reaches it; otherwise at ground level.
  const stop = targetHeightM > 0 && forecastShot({ speedMps, angleDeg: elevationDeg, dragK_perM, windXMps: windMps, targetHeightM }).reachesTarget ? targetHeightM : Math.min(0, targetHeightM);
  const probe = simulateTrajectory({ dragK_perM, gravityMps2: STANDARD_GRAVITY_MPS2, windXMps: windMps }, launch, { stopAtHeightM: stop });
  const t = probe.endTS;
  const times = Array.from({ length: 81 }, (_, i) => (t * i) / 80);
  const run = simulateTrajectory({ dragK_perM, gravityMps2: STANDARD_GRAVITY_MPS2, windXMps: windMps }, launch, { timesS: times });
  return run.points.map((p) => ({ xM: p.xM, yM: p.yM }));
}
