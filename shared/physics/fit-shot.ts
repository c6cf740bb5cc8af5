// fitShot: from marks to launch speed, angle and drag with honest intervals.
// Pure and deterministic: the same input gives a bit-identical result, and
// the result is plain JSON-safe data.
//
// The work runs in named stages (shared/physics/fit-stages/), each passing a
// named record to the next:
//   fitModels → judgeDrag (→ headlineOf) → uncertaintyBudget → flowChecks → muzzleStage → fitCautions
import { ballisticCoefficientKgM2 } from './derived';
import { DRAG_PARAMETER_NAMES } from './drag-fit';
import { fitCautions } from './fit-stages/fit-cautions';
import { checkFitInput, fitModels } from './fit-stages/fit-models';
import { flowChecks } from './fit-stages/flow-checks';
import { headlineOf, judgeDrag } from './fit-stages/judge-drag';
import { muzzleStage } from './fit-stages/muzzle-stage';
import { uncertaintyBreakdown, uncertaintyBudget } from './fit-stages/uncertainty-budget';
import type { FitShotInput, FitShotResult } from './types';
import { FitInputError } from './validate-marks';

export function fitShot(input: FitShotInput): FitShotResult {
  checkFitInput(input);
  const models = fitModels(input);
  const judgement = judgeDrag(models);
  const headline = headlineOf(models, judgement);
  const budget = uncertaintyBudget(input, models, headline);
  const flow = flowChecks(input, models);
  const muzzle = muzzleStage(input, models, judgement, budget);
  const cd = budget.dragCoefficient.value;
  const k = models.params.dragK_perM;
  const fit = models.drag.fit;
  const cautions = fitCautions(input, models, judgement, cd, budget);

  return {
    model: headline.model,
    tRefS: models.drag.tRefS,
    x0M: headline.x0M,
    y0M: headline.y0M,
    launchSpeedMps: budget.launchSpeedMps,
    launchAngleDeg: budget.launchAngleDeg,
    dragK_perM: budget.dragK_perM,
    dragCoefficient: budget.dragCoefficient,
    rmsResidualM: headline.rmsResidualM,
    dragResolved: judgement.dragResolved,
    dragVerdict: judgement.dragVerdict,
    degreesOfFreedom: models.degreesOfFreedom,
    parameterNames: [...DRAG_PARAMETER_NAMES],
    correlation: fit.correlation,
    residuals: models.residuals,
    outlierCount: models.outlierCount,
    modelComparison: judgement.modelComparison,
    dragFree: models.free.result,
    uncertaintyBreakdown: uncertaintyBreakdown(budget),
    derived: {
      reynoldsMin: flow.reynoldsMin,
      reynoldsMax: flow.reynoldsMax,
      machMax: flow.machMax,
      ballisticCoefficientKgM2: cd > 0 ? ballisticCoefficientKgM2(input.massKg, cd, input.diameterM) : null,
      dragLengthM: k > 0 ? 1 / k : null,
    },
    muzzle: muzzle.muzzle,
    cautions: [...flow.cautions, ...muzzle.cautions, ...cautions.cautions],
    iterations: fit.iterations,
    converged: fit.converged,
    exposureShiftS: input.exposureShiftS ?? 0,
    gravityCheck: cautions.gravityCheck,
  };
}

export { FitInputError };
