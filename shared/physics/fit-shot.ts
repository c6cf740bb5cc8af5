// fitShot: from marks to launch speed, angle and drag with honest intervals.
// Pure and deterministic: the same input gives a bit-identical result, and
// the result is plain JSON-safe data.
import { scaleWithUncertainty } from '../geometry/scale-uncertainty';
import { speedOfSoundMps, sutherlandViscosityPaS } from './air';
import { SEA_LEVEL_TEMPERATURE_K, STANDARD_GRAVITY_MPS2 } from './constants';
import { ballisticCoefficientKgM2, checkFlow } from './derived';
import { fitDragFree } from './drag-free-fit';
import { DRAG_PARAMETER_NAMES, fitQuadraticDrag, launchFromParams } from './drag-fit';
import { combinedEstimate, estimate, RAD_TO_DEG } from './estimate';
import { cdFromDragK, dragKFromCd, simulateTrajectory } from './flight';
import { SPHERE_SUBCRITICAL_CD } from './handbook-drag';
import { aicGaussian, bicGaussian } from './information-criteria';
import { muzzleCrossing, muzzleSpeedGradient } from './muzzle';
import { flagOutliers } from './outliers';
import type {
  Estimate, FitShotInput, FitShotResult, InputUncertainties, MarkResidual, MuzzleResult, UncertaintyContribution,
} from './types';
import { FitInputError, requirePositive, validateMarks } from './validate-marks';

/** Relative standard uncertainty of the scale factor: from a marked reference (the calibration's own rule), else as stated. */
export function scaleRelativeUncertainty(u: InputUncertainties | undefined): number {
  if (!u) return 0;
  if (u.scale) return scaleWithUncertainty(u.scale).relStdUncertainty;
  return u.scaleRelative ?? 0;
}

function quadForm(g: number[], cov: number[][]): number {
  let s = 0;
  for (let a = 0; a < g.length; a++) for (let b = 0; b < g.length; b++) s += g[a] * cov[a][b] * g[b];
  return s;
}

export function fitShot(input: FitShotInput): FitShotResult {
  validateMarks(input.marks);
  requirePositive('massKg', input.massKg);
  requirePositive('diameterM', input.diameterM);
  requirePositive('airDensityKgM3', input.airDensityKgM3);
  const g = input.gravityMps2 ?? STANDARD_GRAVITY_MPS2;
  requirePositive('gravityMps2', g);
  const marks = input.marks.map((m) => ({ ...m }));
  const n = marks.length;
  const { massKg, diameterM, airDensityKgM3 } = input;
  const cautions: string[] = [];

  const free = fitDragFree(marks, g);
  const typicalK = dragKFromCd(SPHERE_SUBCRITICAL_CD, diameterM, massKg, airDensityKgM3);
  const drag = fitQuadraticDrag(marks, { gravityMps2: g, startState: free.state, typicalK_perM: typicalK });
  const fit = drag.fit;
  const [x0, y0, speed, angle, k] = fit.params;
  const dof = fit.dof;
  const se = fit.stdErrors;

  // Residuals and robust outlier flags (pooled x and y residuals).
  const rx = fit.residuals.slice(0, n);
  const ry = fit.residuals.slice(n);
  const flags = flagOutliers(rx, ry);
  const residuals: MarkResidual[] = marks.map((m, i) => ({ tS: m.tS, xResidualM: rx[i], yResidualM: ry[i], outlier: flags[i] }));
  const outlierCount = flags.filter(Boolean).length;
  const rmsResidualM = Math.sqrt(fit.residuals.reduce((a, r) => a + r * r, 0) / (2 * n));

  // Model comparison on the same (weighted) residuals.
  const aicDrag = aicGaussian(fit.rss, 2 * n, 5);
  const bicDrag = bicGaussian(fit.rss, 2 * n, 5);
  const { aic: aicDragFree, bic: bicDragFree } = free.result;
  const kStat = estimate(k, se[4], dof);
  const kExcludesZero = kStat.ci95[0] > 0 || kStat.ci95[1] < 0;
  const bicFavoursDrag = bicDrag < bicDragFree;
  const dragResolved = kExcludesZero && bicFavoursDrag && k > 0;
  const dBic = (bicDragFree - bicDrag).toFixed(1);
  let dragVerdict: string;
  if (dragResolved) {
    dragVerdict = `drag resolved: the 95 % interval of k excludes zero and BIC favours the drag model by ${dBic}`;
  } else {
    const reasons: string[] = [];
    if (!kExcludesZero) reasons.push('the 95 % interval of k includes zero');
    if (!bicFavoursDrag) reasons.push(`BIC favours the drag-free model by ${(-Number(dBic)).toFixed(1)}`);
    if (kExcludesZero && k < 0) reasons.push('the fitted k is negative, which no real drag produces');
    dragVerdict = `drag not resolved from this clip: ${reasons.join('; ')}`;
  }

  // Uncertainty sources. Positions scale with the scale factor, so speed's
  // relative error from scale equals the scale's; k has units 1/length, so its
  // relative error from scale is the same size; Cd = 2 m k / (rho A) adds mass,
  // diameter (twice, through the area) and air density.
  const u = input.uncertainties;
  const uScale = scaleRelativeUncertainty(u);
  const uMass = (u?.massKg ?? 0) / massKg;
  const uDiam = (2 * (u?.diameterM ?? 0)) / diameterM;
  const uRho = (u?.airDensityKgM3 ?? 0) / airDensityKgM3;
  const cd = cdFromDragK(k, diameterM, massKg, airDensityKgM3);
  const cdPerK = cd === 0 ? cdFromDragK(1, diameterM, massKg, airDensityKgM3) : cd / k;
  const cdStatSe = Math.abs(cdPerK) * se[4];
  const model: FitShotResult['model'] = dragResolved ? 'quadratic-drag' : 'drag-free';
  const headlineSpeed = dragResolved ? speed : free.result.launchSpeedMps.value;
  const headlineSpeedSe = dragResolved ? se[2] : free.result.launchSpeedMps.stdErr;
  const headlineDof = dragResolved ? dof : 2 * n - 4;
  const absCd = Math.abs(cd);
  const breakdown: UncertaintyContribution[] = [
    { source: 'marking scatter', launchSpeedMps: headlineSpeedSe, dragCoefficient: cdStatSe },
    { source: 'scale', launchSpeedMps: headlineSpeed * uScale, dragCoefficient: absCd * uScale },
    { source: 'mass', launchSpeedMps: 0, dragCoefficient: absCd * uMass },
    { source: 'diameter', launchSpeedMps: 0, dragCoefficient: absCd * uDiam },
    { source: 'air density', launchSpeedMps: 0, dragCoefficient: absCd * uRho },
  ];
  const launchSpeedMps = combinedEstimate(headlineSpeed, headlineSpeedSe, headlineDof, [headlineSpeed * uScale]);
  const dragCoefficient = combinedEstimate(cd, cdStatSe, dof, breakdown.slice(1).map((b) => b.dragCoefficient));
  const dragK_perM = combinedEstimate(k, se[4], dof, [Math.abs(k) * uScale]);
  const launchAngleDeg: Estimate = dragResolved ? estimate(angle * RAD_TO_DEG, se[3] * RAD_TO_DEG, dof) : free.result.launchAngleDeg;
  const x0M: Estimate = dragResolved ? estimate(x0, se[0], dof) : free.result.x0M;
  const y0M: Estimate = dragResolved ? estimate(y0, se[1], dof) : free.result.y0M;

  // Flow regime along the fitted flight.
  const tempK = input.airTemperatureK ?? SEA_LEVEL_TEMPERATURE_K;
  const path = simulateTrajectory(
    { dragK_perM: k, gravityMps2: g }, launchFromParams(fit.params),
    { timesS: marks.map((m) => m.tS - drag.tRefS) },
  );
  const speeds = path.points.map((p) => Math.hypot(p.vxMps, p.vyMps));
  const flow = checkFlow({
    speedMinMps: Math.min(...speeds),
    speedMaxMps: Math.max(...speeds),
    diameterM,
    airDensityKgM3,
    viscosityPaS: sutherlandViscosityPaS(tempK),
    speedOfSoundMps: speedOfSoundMps(tempK),
  });
  cautions.push(...flow.cautions);

  // Muzzle back-extrapolation with its own interval.
  let muzzle: MuzzleResult | null = null;
  if (input.muzzle) {
    const mp = dragResolved ? fit.params : [free.state[0], free.state[1], free.result.launchSpeedMps.value, free.result.launchAngleDeg.value / RAD_TO_DEG, 0];
    const crossing = muzzleCrossing(mp, g, input.muzzle.xM);
    const typical = [1, 1, Math.max(speed, 1), 0.1, typicalK];
    const grad = crossing ? muzzleSpeedGradient(mp, g, input.muzzle.xM, typical) : null;
    if (crossing && grad) {
      // The statistical part comes from the drag fit's covariance (drag-free: k held at zero).
      const gUse = dragResolved ? grad : [grad[0], grad[1], grad[2], grad[3], 0];
      const statSe = Math.sqrt(quadForm(gUse, fit.covariance));
      muzzle = {
        speedMps: combinedEstimate(crossing.speedMps, statSe, dof, [crossing.speedMps * uScale]),
        timeFromFirstMarkS: crossing.dtS,
        heightMissM: crossing.yM - input.muzzle.yM,
      };
      if (Math.abs(muzzle.heightMissM) > Math.max(0.05, 10 * rmsResidualM)) {
        cautions.push(
          `The fitted path passes ${Math.abs(muzzle.heightMissM).toFixed(3)} m ${muzzle.heightMissM > 0 ? 'above' : 'below'} ` +
            'the given muzzle position: check the muzzle mark and the scale.',
        );
      }
    } else {
      cautions.push('The fitted path never reaches the muzzle x position within 10 s, so no muzzle speed is given.');
    }
  }

  // Plain-words cautions about the fit itself.
  if (!fit.converged) cautions.push('The drag fit stopped at its iteration limit before meeting its convergence test.');
  if (outlierCount > 0) {
    cautions.push(`${outlierCount} mark(s) lie more than 3.5 robust standard deviations from the fitted path; check them.`);
  }
  // The free-g parabola checks time base and scale only when drag is negligible;
  // with resolved drag its g absorbs the drag and says nothing about the clip.
  const gFree = free.result.freeGravityMps2;
  if (!dragResolved && Math.abs(gFree.value - g) > 3 * gFree.stdErr && Math.abs(gFree.value / g - 1) > 0.02) {
    cautions.push(
      `A drag-free fit with free gravity gives g = ${gFree.value.toFixed(3)} m/s^2 (expected ${g}): ` +
        'this points at a wrong frame rate or scale.',
    );
  }
  if (k > 0 && dragResolved) {
    const cdRatio = cd / SPHERE_SUBCRITICAL_CD;
    if (cdRatio > 3 || cdRatio < 0.1) {
      cautions.push(`Cd = ${cd.toPrecision(3)} is far from handbook values for compact bodies (0.1 to 1.2); check mass, diameter and scale.`);
    }
  }

  return {
    model,
    tRefS: drag.tRefS,
    x0M,
    y0M,
    launchSpeedMps,
    launchAngleDeg,
    dragK_perM,
    dragCoefficient,
    rmsResidualM: dragResolved ? rmsResidualM : free.result.rmsResidualM,
    dragResolved,
    dragVerdict,
    degreesOfFreedom: dof,
    parameterNames: [...DRAG_PARAMETER_NAMES],
    correlation: fit.correlation,
    residuals,
    outlierCount,
    modelComparison: { aicDrag, aicDragFree, bicDrag, bicDragFree },
    dragFree: free.result,
    uncertaintyBreakdown: breakdown,
    derived: {
      reynoldsMin: flow.reynoldsMin,
      reynoldsMax: flow.reynoldsMax,
      machMax: flow.machMax,
      ballisticCoefficientKgM2: cd > 0 ? ballisticCoefficientKgM2(massKg, cd, diameterM) : null,
      dragLengthM: k > 0 ? 1 / k : null,
    },
    muzzle,
    cautions,
    iterations: fit.iterations,
    converged: fit.converged,
  };
}

export { FitInputError };
