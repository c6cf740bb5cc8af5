// Gathers everything a fit needs from the records: the track's marks in world
// units (through the clip's current calibration and frame times), the shot's
// conditions, the projectile and launcher. Returns the snapshot that is stored
// with the fit; its `fitInput` is what fitShot sees.
import { and, asc, eq } from 'drizzle-orm';
import { PROJECTILE_DIAMETER_SIGMA_M, PROJECTILE_MASS_SIGMA_KG } from '../../shared/defaults';
import { airForFit } from '../../shared/fits/air-conditions';
import type { FitInputSnapshot, SnapshotMark } from '../../shared/fits/snapshot';
import { buildCalibrationTransform, type CalibrationGeometry } from '../../shared/geometry/calibration-transform';
import { markTimeAndPlace } from '../../shared/marking/mark-world';
import { midExposureShiftS } from '../../shared/physics/exposure-timing';
import type { FitShotInput } from '../../shared/physics/types';
import { alongPlaneWindMps } from '../../shared/physics/wind';
import { isFlagged, type FitMarkCounts } from '../../shared/schemas/auto-mark';
import { reviewThresholdOf } from '../automark/settings';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { marks, tracks } from '../db/schema/marking';
import { launchers, projectiles, shots } from '../db/schema/records';
import { notFound, unprocessable } from '../http/problem';
import { calibrationGeometryOf, currentCalibrationRow } from '../marking/calibration-records';
import { loadFrameTimes } from '../marking/frame-times';
import { lensCovariance } from '../marking/lens-correction';
import { lensMarkShifts } from '../../shared/geometry/lens-shifts';
import type { CalibrationTransform } from '../../shared/geometry/calibration-transform';
import type { CameraUncertainties } from '../../shared/physics/camera-budget';
import type { LensCorrection } from '../../shared/schemas/camera';

/**
 * What the calibration leaves uncertain about the marks' metres: the plane
 * offset (absent when none was stated, which the fit cautions about), the
 * roll, and the lens — each mark's world shift per 1σ step of the
 * coefficients, computed through the whole pixel → world chain.
 */
function cameraUncertainties(
  geometry: CalibrationGeometry, transform: CalibrationTransform, lens: LensCorrection | null, marks: readonly SnapshotMark[],
): CameraUncertainties {
  const camera: CameraUncertainties = { rollSigmaRad: transform.rollStdUncertaintyRad };
  if (transform.planeOffset) camera.planeOffsetRel = transform.planeOffset.relStdUncertainty;
  if (lens && geometry.lens) {
    const frame = geometry.lens;
    camera.lensShifts = lensMarkShifts(
      marks.map((m) => ({ u: m.uPx, v: m.vPx })),
      { k1: lens.k1, k2: lens.k2 },
      lensCovariance(lens),
      (c) => {
        const t = buildCalibrationTransform({ ...geometry, lens: { ...frame, k1: c.k1, k2: c.k2 } });
        return (p) => t.imageToWorld(p);
      },
    );
  }
  return camera;
}

export async function buildFitSnapshot(db: Db, teamId: string, trackId: string): Promise<FitInputSnapshot> {
  const [track] = await db.select().from(tracks).where(and(eq(tracks.id, trackId), eq(tracks.teamId, teamId)));
  if (!track) throw notFound('No such track in this team.');
  if (track.kind !== 'projectile') throw unprocessable('Fits run on a projectile track; this one marks the muzzle.');
  const [clip] = await db.select().from(clips).where(eq(clips.id, track.clipId));
  if (!clip) throw notFound('The track’s clip is gone.');
  const [shot] = await db.select().from(shots).where(eq(shots.id, clip.shotId));
  if (!shot) throw notFound('The clip’s shot is gone.');
  if (!shot.projectileId) throw unprocessable('The shot has no projectile: set one (mass and diameter are needed for Cd) and run the fit again.');
  const [projectile] = await db.select().from(projectiles).where(eq(projectiles.id, shot.projectileId));
  if (!projectile) throw unprocessable('The shot’s projectile no longer exists.');
  const [launcher] = shot.launcherId ? await db.select().from(launchers).where(eq(launchers.id, shot.launcherId)) : [];
  // The same calibration and frame times the marks API shows metres with (server/marking).
  const calibration = await currentCalibrationRow(db, clip.id);
  if (!calibration) throw unprocessable('The clip is not calibrated: set scale, origin and level first.');
  const geometry = calibrationGeometryOf(calibration);
  const transform = buildCalibrationTransform(geometry);

  const markRows = await db.select().from(marks).where(eq(marks.trackId, track.id)).orderBy(asc(marks.frameNumber));
  // The muzzle: the first mark of the clip's first muzzle track, if any.
  const [muzzleTrack] = await db
    .select()
    .from(tracks)
    .where(and(eq(tracks.clipId, clip.id), eq(tracks.kind, 'muzzle')))
    .orderBy(asc(tracks.createdAt))
    .limit(1);
  const [muzzleMark] = muzzleTrack
    ? await db.select().from(marks).where(eq(marks.trackId, muzzleTrack.id)).orderBy(asc(marks.frameNumber)).limit(1)
    : [];

  // Automatic marks below the team's review threshold wait for a person's look and stay out of the fit.
  const reviewThreshold = await reviewThresholdOf(db, teamId);
  const leftOutRows = markRows.filter((m) => isFlagged(m, reviewThreshold));
  const fitRows = markRows.filter((m) => !isFlagged(m, reviewThreshold));
  const markCounts: FitMarkCounts = {
    automatic: fitRows.filter((m) => m.source === 'auto').length,
    byHand: fitRows.filter((m) => m.source !== 'auto').length,
    leftOut: leftOutRows.length,
    reviewThreshold,
    leftOutFrames: leftOutRows.map((m) => ({ frameNumber: m.frameNumber, confidence: m.confidence ?? 0, reason: m.lowConfidenceReason })),
  };
  const timeOf = await loadFrameTimes(db, clip, fitRows.map((m) => m.frameNumber));
  const snapshotMarks: SnapshotMark[] = [];
  for (const m of fitRows) {
    const { tS, xM, yM } = markTimeAndPlace(m, transform, timeOf);
    if (tS === null) throw unprocessable(`Frame ${m.frameNumber} has no time: the clip has no frame table and no capture rate.`);
    if (xM === null || yM === null) throw new Error('a calibrated transform gave no world position');
    snapshotMarks.push({ frameNumber: m.frameNumber, tS, uPx: m.uPx, vPx: m.vPx, xM, yM });
  }
  snapshotMarks.sort((a, b) => a.tS - b.tS);
  const muzzleWorld = muzzleMark ? transform.imageToWorld({ u: muzzleMark.uPx, v: muzzleMark.vPx }) : null;

  // A directly stated density (shot.airDensityKgM3) wins over the weather readings, as in the fit command.
  const air = airForFit(shot);
  // The exposure timing and the wind enter the fit input only when stated, so fits of records that state
  // neither keep their input hash; stating or changing either changes it.
  const exposureShiftS = clip.shutterS === null ? undefined : midExposureShiftS(clip.shutterS, clip.frameStamp);
  const wind = shot.windSpeedMps === null || shot.windFromDeg === null ? null : { speedMps: shot.windSpeedMps, fromDeg: shot.windFromDeg };
  const massSigma = PROJECTILE_MASS_SIGMA_KG;
  const diameterSigma = PROJECTILE_DIAMETER_SIGMA_M;
  const fitInput: FitShotInput = {
    ...(exposureShiftS !== undefined ? { exposureShiftS } : {}),
    ...(wind ? { windXMps: alongPlaneWindMps(wind) } : {}),
    marks: snapshotMarks.map((m) => ({ tS: m.tS, xM: m.xM, yM: m.yM })),
    massKg: projectile.massKg,
    diameterM: projectile.diameterM,
    airDensityKgM3: air.densityKgM3,
    uncertainties: {
      massKg: massSigma,
      diameterM: diameterSigma,
      airDensityKgM3: air.densitySigmaKgM3,
      scaleRelative: calibration.scaleRelUncertainty,
      camera: cameraUncertainties(geometry, transform, calibration.lens, snapshotMarks),
    },
    airTemperatureK: air.temperatureK,
    ...(muzzleWorld ? { muzzle: { xM: muzzleWorld.x, yM: muzzleWorld.y } } : {}),
  };

  const { id: _id, ...calibrationRecord } = calibration;
  return {
    schemaVersion: 1,
    shot: {
      id: shot.id,
      label: shot.label,
      airTempC: shot.airTempC,
      stationPressurePa: shot.stationPressurePa,
      relativeHumidityPct: shot.relativeHumidityPct,
      chamberPressurePa: shot.chamberPressurePa,
      elevationDeg: shot.elevationDeg,
      wind,
      launchHeightM: shot.launchHeightM,
      airDensityKgM3: shot.airDensityKgM3,
      airDensityTolKgM3: shot.airDensityTolKgM3,
    },
    projectile: {
      id: projectile.id,
      name: projectile.name,
      massKg: projectile.massKg,
      diameterM: projectile.diameterM,
      referenceAreaM2: projectile.referenceAreaM2,
    },
    launcher: launcher
      ? { id: launcher.id, name: launcher.name, boreM: launcher.boreM, barrelLengthM: launcher.barrelLengthM, chamberVolumeM3: launcher.chamberVolumeM3 }
      : null,
    clip: { id: clip.id, frameRateHz: clip.captureFps, shutterS: clip.shutterS, frameStamp: clip.frameStamp },
    calibration: {
      id: calibration.id,
      version: calibration.version,
      pixelsPerMetre: calibration.pixelsPerMetre,
      scaleRelUncertainty: calibration.scaleRelUncertainty,
      geometry: JSON.parse(JSON.stringify(geometry)) as CalibrationGeometry,
      record: JSON.parse(JSON.stringify(calibrationRecord)) as Record<string, unknown>,
    },
    track: { id: track.id, kind: track.kind, marksRevision: track.revision },
    marks: snapshotMarks,
    markCounts,
    muzzle: muzzleMark && muzzleWorld && muzzleTrack
      ? { trackId: muzzleTrack.id, uPx: muzzleMark.uPx, vPx: muzzleMark.vPx, xM: muzzleWorld.x, yM: muzzleWorld.y }
      : null,
    air: { densityKgM3: air.densityKgM3, temperatureK: air.temperatureK, source: air.source },
    uncertainties: {
      massKg: { value: massSigma, source: 'stated default: 0.1 g balance reading (common practice)' },
      diameterM: { value: diameterSigma, source: 'stated default: 0.05 mm calliper reading (common practice)' },
      airDensityKgM3: { value: air.densitySigmaKgM3, source: air.sigmaSource },
      scaleRelative: { value: calibration.scaleRelUncertainty, source: `calibration version ${calibration.version} (reference length tolerance and end-point clicks, GUM)` },
    },
    fitInput,
  };
}
