// Test support: how an auto-marking outcome compares with the generator's
// truth, and the fit the product would run on the automatic marks alone.
import type { ClipTruth } from '../../fixtures/clip-generator';
import { buildCalibrationTransform } from '../../../shared/geometry/calibration-transform';
import { fitShot } from '../../../shared/physics/fit-shot';
import { dragKFromCd, simulateTrajectory } from '../../../shared/physics/flight';
import type { FitShotResult } from '../../../shared/physics/types';
import { CLICK_SIGMA_PX, PROJECTILE_DIAMETER_SIGMA_M, PROJECTILE_MASS_SIGMA_KG } from '../../../shared/defaults';
import { DEFAULT_REVIEW_THRESHOLD, type AutoMarkOutcome } from '../types';

/** Tolerance of the scale bar's stated length, as the API fit scenario enters it (tests/support/fit-scenario.ts). */
const SCALE_LENGTH_TOL_M = 0.002;

export interface Accuracy {
  /** Frames in flight where the projectile is fully visible. */
  visibleFrames: number;
  /** Of those, marked within 1 px of the truth. */
  within1Px: number;
  fractionWithin1Px: number;
  maxErrorPx: number;
  medianErrorPx: number;
  marksOnHiddenFrames: number[];
  marksBeforeLaunch: number[];
  launchFrameError: number | null;
}

export function accuracyOf(truth: ClipTruth, outcome: AutoMarkOutcome): Accuracy {
  const byFrame = new Map(outcome.marks.map((m) => [m.frameNumber, m]));
  const errors = outcome.marks.map((m) => {
    const t = truth.frames[m.frameNumber];
    return Math.hypot(m.uPx - t.uPx, m.vPx - t.vPx);
  });
  const visible = truth.frames.filter((f) => f.inFlight && f.visibility === 'visible');
  const within = visible.filter((f) => {
    const m = byFrame.get(f.frameNumber);
    return m && Math.hypot(m.uPx - f.uPx, m.vPx - f.vPx) <= 1;
  });
  const sorted = [...errors].sort((a, b) => a - b);
  return {
    visibleFrames: visible.length,
    within1Px: within.length,
    fractionWithin1Px: visible.length ? within.length / visible.length : 0,
    maxErrorPx: errors.length ? Math.max(...errors) : Infinity,
    medianErrorPx: sorted.length ? sorted[sorted.length >> 1] : Infinity,
    marksOnHiddenFrames: outcome.marks.filter((m) => truth.frames[m.frameNumber].visibility === 'hidden').map((m) => m.frameNumber),
    marksBeforeLaunch: outcome.marks.filter((m) => !truth.frames[m.frameNumber].inFlight).map((m) => m.frameNumber),
    launchFrameError: outcome.launchFrame === null ? null : outcome.launchFrame - truth.launchFrame,
  };
}

export interface FitCheck {
  fit: FitShotResult;
  marksUsed: number;
  /** The generator's speed at the time of the first mark used (the fit's launch state refers to it). */
  truthSpeedMps: number;
  speedError: number;
  cdError: number;
}

/**
 * fitShot on the automatic marks at or above the review threshold (the
 * product's default), through the calibration a person would set from the
 * clip's scale bar, launch point and level line (shared/geometry, as the
 * server's fit input builder does), with frame times from the truth file and
 * the input uncertainties the server states (shared/defaults; the scale's from
 * the calibration). `statOnly` leaves those out: intervals from marking scatter alone.
 */
export function fitFromMarks(truth: ClipTruth, outcome: AutoMarkOutcome, statOnly = false): FitCheck {
  const transform = buildCalibrationTransform({
    scale: { p1: truth.scaleReference.p1, p2: truth.scaleReference.p2, lengthM: truth.scaleReference.lengthM, lengthTolM: SCALE_LENGTH_TOL_M, endpointSigmaPx: CLICK_SIGMA_PX },
    origin: truth.originPx,
    level: { kind: 'line', p1: truth.levelLine.p1, p2: truth.levelLine.p2 },
    downrange: 'right',
    plane: null,
  });
  const used = outcome.marks.filter((m) => m.confidence >= DEFAULT_REVIEW_THRESHOLD);
  const marks = used.map((m) => {
    const w = transform.imageToWorld({ u: m.uPx, v: m.vPx });
    return { tS: truth.frames[m.frameNumber].tS, xM: w.x, yM: w.y };
  });
  const fit = fitShot({
    marks,
    massKg: truth.massKg,
    diameterM: truth.diameterM,
    airDensityKgM3: truth.airDensityKgM3,
    gravityMps2: truth.gravityMps2,
    uncertainties: statOnly
      ? undefined
      : { massKg: PROJECTILE_MASS_SIGMA_KG, diameterM: PROJECTILE_DIAMETER_SIGMA_M, scaleRelative: transform.scaleRelUncertainty },
  });
  const angle = (truth.launchAngleDeg * Math.PI) / 180;
  const k = dragKFromCd(truth.dragCoefficient, truth.diameterM, truth.massKg, truth.airDensityKgM3);
  const dt = fit.tRefS - truth.launchTimeS;
  const path = simulateTrajectory(
    { dragK_perM: k, gravityMps2: truth.gravityMps2 },
    { xM: 0, yM: 0, vxMps: truth.launchSpeedMps * Math.cos(angle), vyMps: truth.launchSpeedMps * Math.sin(angle) },
    { timesS: [Math.max(0, dt)] },
  );
  const p = path.points[0];
  const truthSpeedMps = Math.hypot(p.vxMps, p.vyMps);
  return {
    fit,
    marksUsed: marks.length,
    truthSpeedMps,
    speedError: fit.launchSpeedMps.value / truthSpeedMps - 1,
    cdError: fit.dragCoefficient.value / truth.dragCoefficient - 1,
  };
}
