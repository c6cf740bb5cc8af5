// Stage 1 of fitShot: fit both models to the marks and read the drag fit's
// residuals. Everything later stages need from the fits is named here.
import { STANDARD_GRAVITY_MPS2 } from '../constants';
import { fitDragFree, type DragFreeDetail } from '../drag-free-fit';
import { dragParamsOf, fitQuadraticDrag, type DragFit, type DragParams } from '../drag-fit';
import { dragKFromCd } from '../flight';
import { SPHERE_SUBCRITICAL_CD } from '../handbook-drag';
import { flagOutliers } from '../outliers';
import type { FitMark, FitShotInput, MarkResidual } from '../types';
import { requirePositive, validateMarks } from '../validate-marks';

export interface FittedModels {
  /** The input marks, copied. */
  marks: FitMark[];
  gravityMps2: number;
  /** k of a handbook sphere of this size and mass: the scale of k near zero. */
  typicalK_perM: number;
  /** The drag-free parabola (g fixed and g free). */
  free: DragFreeDetail;
  /** The quadratic-drag fit. */
  drag: DragFit;
  /** Its parameters and their standard errors, by name. */
  params: DragParams;
  stdErrors: DragParams;
  degreesOfFreedom: number;
  residuals: MarkResidual[];
  outlierCount: number;
  /** RMS of the drag fit's residuals, pooled over x and y. */
  rmsResidualM: number;
}

/** Throws FitInputError for input no fit can use. */
export function checkFitInput(input: FitShotInput): void {
  validateMarks(input.marks);
  requirePositive('massKg', input.massKg);
  requirePositive('diameterM', input.diameterM);
  requirePositive('airDensityKgM3', input.airDensityKgM3);
  requirePositive('gravityMps2', input.gravityMps2 ?? STANDARD_GRAVITY_MPS2);
}

export function fitModels(input: FitShotInput): FittedModels {
  const gravityMps2 = input.gravityMps2 ?? STANDARD_GRAVITY_MPS2;
  // Mark times move to mid-exposure, where a blurred body's centre is (exposure-timing.ts).
  const shift = input.exposureShiftS ?? 0;
  const marks = input.marks.map((m) => ({ ...m, tS: m.tS + shift }));
  const n = marks.length;
  const free = fitDragFree(marks, gravityMps2);
  const typicalK_perM = dragKFromCd(SPHERE_SUBCRITICAL_CD, input.diameterM, input.massKg, input.airDensityKgM3);
  const drag = fitQuadraticDrag(marks, { gravityMps2, startState: free.state, typicalK_perM, windXMps: input.windXMps ?? 0 });
  const fit = drag.fit;

  // Residuals and robust outlier flags (pooled x and y residuals).
  const rx = fit.residuals.slice(0, n);
  const ry = fit.residuals.slice(n);
  const flags = flagOutliers(rx, ry);
  const residuals: MarkResidual[] = marks.map((m, i) => ({ tS: m.tS, xResidualM: rx[i], yResidualM: ry[i], outlier: flags[i] }));
  return {
    marks,
    gravityMps2,
    typicalK_perM,
    free,
    drag,
    params: dragParamsOf(fit.params),
    stdErrors: dragParamsOf(fit.stdErrors),
    degreesOfFreedom: fit.dof,
    residuals,
    outlierCount: flags.filter(Boolean).length,
    rmsResidualM: Math.sqrt(fit.residuals.reduce((a, r) => a + r * r, 0) / (2 * n)),
  };
}
