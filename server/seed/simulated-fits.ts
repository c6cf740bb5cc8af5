// Approved fits without a clip: marks computed from a known flight (the
// physics core's own integrator) plus seeded Gaussian noise, fitted by the real
// fitShot and stored as the fits area stores them. The demo team needs approved
// fits to pool into presets before anyone has filmed a shot, and the preset
// tests need them without paying for video extraction. The shot's notes say so.
import { randomUUID } from 'node:crypto';
import { airForFit } from '../../shared/fits/air-conditions';
import type { FitInputSnapshot } from '../../shared/fits/snapshot';
import { fitShot } from '../../shared/physics/fit-shot';
import { dragKFromCd, simulateTrajectory } from '../../shared/physics/flight';
import { forecastShot } from '../../shared/physics/forecast';
import type { FitMark } from '../../shared/physics/types';
import { modelSpeedMps, launcherModelFor, muzzleSpeedFromEfficiency } from '../../shared/presets/launcher-speed';
import { mulberry32, normalDeviates } from '../../shared/random/prng';
import type { Db } from '../db/client';
import { fits } from '../db/schema/fits';
import { shots, type launchers, type projectiles } from '../db/schema/records';
import { inputHash } from '../fits/input-hash';
import { headlineColumns } from '../fits/run-fit';

export interface SimulatedShotSpec {
  label: string;
  chamberPressurePa: number;
  elevationDeg: number;
  /** The true values the flight is simulated with. */
  trueDragCoefficient: number;
  trueEfficiency: number;
  seed: number;
  airTempC?: number;
  stationPressurePa?: number;
  relativeHumidityPct?: number;
  /** Standard deviation of the position noise on each mark. */
  markSigmaM?: number;
}

const FRAME_RATE_HZ = 240;
const FRAMES = 120;
const FIRST_MARK_S = 0.02;

type LauncherRow = typeof launchers.$inferSelect;
type ProjectileRow = typeof projectiles.$inferSelect;

/** Creates the shot and an approved fit of it; returns both ids. */
export async function createSimulatedApprovedFit(
  db: Db,
  args: { teamId: string; seriesId: string; launcher: LauncherRow; projectile: ProjectileRow; reviewerId: string | null; spec: SimulatedShotSpec },
): Promise<{ shotId: string; fitId: string }> {
  const { teamId, seriesId, launcher, projectile, reviewerId, spec } = args;
  const conditions = { airTempC: spec.airTempC ?? 14, stationPressurePa: spec.stationPressurePa ?? 101100, relativeHumidityPct: spec.relativeHumidityPct ?? 70 };
  const air = airForFit(conditions);
  const model = modelSpeedMps(launcherModelFor(launcher), launcher, spec.chamberPressurePa, projectile.massKg, conditions.stationPressurePa);
  const speed = muzzleSpeedFromEfficiency(model, spec.trueEfficiency);
  const k = dragKFromCd(spec.trueDragCoefficient, projectile.diameterM, projectile.massKg, air.densityKgM3);
  const th = (spec.elevationDeg * Math.PI) / 180;
  const times = Array.from({ length: FRAMES }, (_, i) => FIRST_MARK_S + i / FRAME_RATE_HZ);
  const path = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 0, vxMps: speed * Math.cos(th), vyMps: speed * Math.sin(th) }, { timesS: [0, ...times] });
  const noise = normalDeviates(mulberry32(spec.seed));
  const sigma = spec.markSigmaM ?? 0.002;
  const marks: FitMark[] = path.points.slice(1).map((p) => ({ tS: p.tS, xM: p.xM + sigma * noise(), yM: p.yM + sigma * noise(), sigmaM: sigma }));
  const fitInput = {
    marks,
    massKg: projectile.massKg,
    diameterM: projectile.diameterM,
    airDensityKgM3: air.densityKgM3,
    uncertainties: { massKg: 0.0001, diameterM: 0.00005, airDensityKgM3: air.densitySigmaKgM3, scaleRelative: 0.001 },
    muzzle: { xM: 0, yM: 0 },
    airTemperatureK: air.temperatureK,
  };
  const result = fitShot(JSON.parse(JSON.stringify(fitInput)));
  // The tape reading: the true flight to level ground, read to the nearest 0.1 m.
  const trueRange = forecastShot({ speedMps: speed, angleDeg: spec.elevationDeg, dragK_perM: k }).rangeM;
  const tapeRangeM = trueRange === null ? null : Math.round((trueRange + 0.3 * noise()) * 10) / 10;

  const [shot] = await db
    .insert(shots)
    .values({
      teamId,
      seriesId,
      launcherId: launcher.id,
      projectileId: projectile.id,
      label: spec.label,
      chamberPressurePa: spec.chamberPressurePa,
      elevationDeg: spec.elevationDeg,
      ...conditions,
      tapeRangeM,
      notes: 'Simulated shot: marks computed from a known flight with 2 mm noise, no clip. Fitted and approved like a filmed one.',
    })
    .returning({ id: shots.id });
  const clipId = randomUUID(), trackId = randomUUID(), calibrationId = randomUUID();
  const snapshot: FitInputSnapshot = {
    schemaVersion: 1,
    shot: { id: shot.id, label: spec.label, ...conditions, chamberPressurePa: spec.chamberPressurePa, elevationDeg: spec.elevationDeg },
    projectile: { id: projectile.id, name: projectile.name, massKg: projectile.massKg, diameterM: projectile.diameterM, referenceAreaM2: projectile.referenceAreaM2 },
    launcher: { id: launcher.id, name: launcher.name, boreM: launcher.boreM, barrelLengthM: launcher.barrelLengthM, chamberVolumeM3: launcher.chamberVolumeM3 },
    clip: { id: clipId, frameRateHz: FRAME_RATE_HZ },
    calibration: {
      id: calibrationId,
      version: 1,
      pixelsPerMetre: 100,
      scaleRelUncertainty: 0.001,
      geometry: {
        scale: { p1: { u: 100, v: 900 }, p2: { u: 300, v: 900 }, lengthM: 2, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
        origin: { u: 100, v: 900 },
        level: { kind: 'line', p1: { u: 100, v: 900 }, p2: { u: 300, v: 900 } },
        downrange: 'right',
        plane: null,
      } as FitInputSnapshot['calibration']['geometry'],
      record: { simulated: true },
    },
    track: { id: trackId, kind: 'projectile', marksRevision: 1 },
    marks: marks.map((m, i) => ({ frameNumber: i + Math.round(FIRST_MARK_S * FRAME_RATE_HZ), tS: m.tS, uPx: 100 + m.xM * 100, vPx: 900 - m.yM * 100, xM: m.xM, yM: m.yM })),
    muzzle: { trackId, uPx: 100, vPx: 900, xM: 0, yM: 0 },
    air: { densityKgM3: air.densityKgM3, temperatureK: air.temperatureK, source: air.source },
    uncertainties: {
      massKg: { value: 0.0001, source: 'stated default: 0.1 g balance reading (common practice)' },
      diameterM: { value: 0.00005, source: 'stated default: 0.05 mm calliper reading (common practice)' },
      airDensityKgM3: { value: air.densitySigmaKgM3, source: air.sigmaSource },
      scaleRelative: { value: 0.001, source: 'simulated shot: 0.1 % scale uncertainty stated' },
    },
    fitInput,
  };
  const now = new Date();
  const [fit] = await db
    .insert(fits)
    .values({
      teamId,
      shotId: shot.id,
      clipId,
      trackId,
      calibrationId,
      calibrationVersion: 1,
      marksRevision: 1,
      state: 'approved',
      inputSnapshot: snapshot,
      inputHash: inputHash(snapshot.fitInput),
      result,
      ...headlineColumns(result),
      createdBy: reviewerId,
      reviewedBy: reviewerId,
      reviewedAt: now,
      reviewNote: 'Simulated shot for the demo; numbers checked against the flight it was made from.',
    })
    .returning({ id: fits.id });
  return { shotId: shot.id, fitId: fit.id };
}
