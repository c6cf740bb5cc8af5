// Stage 3 of fitShot: the uncertainty budget, one row per source, combined in
// quadrature (GUM JCGM 100:2008 §5.1.2, sources independent, first order).
// The first row is the fit's own statistical scatter (Student t); every other
// row is a systematic source (normal). A new source is one more row: give its
// standard uncertainty on each result and it flows into every interval.
//
// Positions scale with the scale factor, so speed's relative error from scale
// equals the scale's; k has units 1/length, so its relative error from scale
// is the same size; Cd = 2 m k / (rho A) adds mass, diameter (twice, through
// the area) and air density.
//
// The camera's rows (lens, plane offset, level: shared/physics/camera-budget.ts)
// move all marks together in a fixed pattern; their effect on speed, angle and
// k is propagated through the fits to first order. The launch angle gets its
// systematic rows from those and from the scale (with gravity fixed, a scale
// error reads as a g error, which the fit meets partly by turning the angle).
import { scaleWithUncertainty } from '../../geometry/scale-uncertainty';
import { combinedEstimate } from '../estimate';
import { cdFromDragK } from '../flight';
import type { Estimate, FitShotInput, InputUncertainties, UncertaintyContribution, UncertaintySource } from '../types';
import { cameraRows, scaleLikeRow } from '../camera-budget';
import type { FittedModels } from './fit-models';
import type { Headline } from './judge-drag';

export interface UncertaintyRow {
  source: UncertaintySource;
  /** Standard uncertainty this source puts on the headline launch speed, m/s. */
  launchSpeedMps: number;
  /** … on Cd. */
  dragCoefficient: number;
  /** … on k, 1/m. */
  dragK_perM: number;
  /** … on the launch angle, degrees. */
  launchAngleDeg: number;
  /** Relative standard uncertainty it puts on any fitted speed (used for the muzzle speed); 0 for the statistical row. */
  speedRel: number;
}

export interface UncertaintyBudget {
  /** rows[0] is the statistical row; the rest are systematic. */
  rows: UncertaintyRow[];
  launchSpeedMps: Estimate;
  launchAngleDeg: Estimate;
  dragCoefficient: Estimate;
  dragK_perM: Estimate;
}

/** Relative standard uncertainty of the scale factor: from a marked reference (the calibration's own rule), else as stated. */
export function scaleRelativeUncertainty(u: InputUncertainties | undefined): number {
  if (!u) return 0;
  if (u.scale) return scaleWithUncertainty(u.scale).relStdUncertainty;
  return u.scaleRelative ?? 0;
}

export function uncertaintyBudget(input: FitShotInput, models: FittedModels, headline: Headline): UncertaintyBudget {
  const { massKg, diameterM, airDensityKgM3 } = input;
  const u = input.uncertainties;
  const k = models.params.dragK_perM;
  const kStdErr = models.stdErrors.dragK_perM;
  const dof = models.degreesOfFreedom;
  const uScale = scaleRelativeUncertainty(u);
  const uMass = (u?.massKg ?? 0) / massKg;
  const uDiam = (2 * (u?.diameterM ?? 0)) / diameterM;
  const uRho = (u?.airDensityKgM3 ?? 0) / airDensityKgM3;
  const cd = cdFromDragK(k, diameterM, massKg, airDensityKgM3);
  const cdPerK = cd === 0 ? cdFromDragK(1, diameterM, massKg, airDensityKgM3) : cd / k;
  const absCd = Math.abs(cd);
  const speed = headline.launchSpeedMps;
  const cameraInput = {
    marks: models.marks,
    dragFit: models.drag.fit,
    dragResolved: headline.model === 'quadratic-drag',
    dragFreeVelocity: { vxMps: models.free.state[2], vyMps: models.free.state[3] },
    tRefS: models.drag.tRefS,
    headlineSpeedMps: speed,
    dragK_perM: k,
    camera: u?.camera ?? {},
  };
  const scaleAngle = uScale > 0 ? scaleLikeRow(cameraInput, 'scale', uScale).launchAngleDeg : 0;
  const rows: UncertaintyRow[] = [
    {
      source: 'marking scatter', launchSpeedMps: headline.launchSpeedStdErr, dragCoefficient: Math.abs(cdPerK) * kStdErr, dragK_perM: kStdErr,
      launchAngleDeg: headline.launchAngleDeg.stdErr, speedRel: 0,
    },
    { source: 'scale', launchSpeedMps: speed * uScale, dragCoefficient: absCd * uScale, dragK_perM: Math.abs(k) * uScale, launchAngleDeg: scaleAngle, speedRel: uScale },
    { source: 'mass', launchSpeedMps: 0, dragCoefficient: absCd * uMass, dragK_perM: 0, launchAngleDeg: 0, speedRel: 0 },
    { source: 'diameter', launchSpeedMps: 0, dragCoefficient: absCd * uDiam, dragK_perM: 0, launchAngleDeg: 0, speedRel: 0 },
    { source: 'air density', launchSpeedMps: 0, dragCoefficient: absCd * uRho, dragK_perM: 0, launchAngleDeg: 0, speedRel: 0 },
    ...cameraRows(cameraInput).map((r) => ({
      source: r.source as UncertaintySource,
      launchSpeedMps: r.launchSpeedMps,
      dragCoefficient: Math.abs(cdPerK * r.dragK_perM),
      dragK_perM: r.dragK_perM,
      launchAngleDeg: r.launchAngleDeg,
      speedRel: r.speedRel,
    })),
  ];
  const [scatter, ...systematic] = rows;
  const angle = headline.launchAngleDeg;
  return {
    rows,
    launchSpeedMps: combinedEstimate(speed, scatter.launchSpeedMps, headline.launchSpeedDof, systematic.map((r) => r.launchSpeedMps)),
    launchAngleDeg: combinedEstimate(angle.value, angle.stdErr, headline.launchSpeedDof, systematic.map((r) => r.launchAngleDeg)),
    dragCoefficient: combinedEstimate(cd, scatter.dragCoefficient, dof, systematic.map((r) => r.dragCoefficient)),
    dragK_perM: combinedEstimate(k, scatter.dragK_perM, dof, systematic.map((r) => r.dragK_perM)),
  };
}

/** A speed's systematic standard uncertainties, one per systematic row. */
export function systematicSpeedUncertainties(budget: UncertaintyBudget, speedMps: number): number[] {
  return budget.rows.slice(1).map((r) => speedMps * r.speedRel);
}

/** The budget as the result reports it. */
export function uncertaintyBreakdown(budget: UncertaintyBudget): UncertaintyContribution[] {
  return budget.rows.map((r) => ({ source: r.source, launchSpeedMps: r.launchSpeedMps, dragCoefficient: r.dragCoefficient, launchAngleDeg: r.launchAngleDeg }));
}
