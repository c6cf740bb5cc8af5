// Stage 2 of fitShot: is drag resolved by this clip? Both tests must agree:
// the 95 % interval of k excludes zero, and BIC prefers the drag model. The
// headline numbers then come from that model, else from the drag-free fit.
import { DRAG_MODEL_PARAMETER_COUNT } from '../validate-marks';
import { estimate, RAD_TO_DEG } from '../estimate';
import { aicGaussian, bicGaussian } from '../information-criteria';
import type { Estimate, FitShotResult, ModelComparison } from '../types';
import type { FittedModels } from './fit-models';

export interface DragJudgement {
  dragResolved: boolean;
  dragVerdict: string;
  modelComparison: ModelComparison;
}

export function judgeDrag(models: FittedModels): DragJudgement {
  const { drag, free, params, stdErrors, degreesOfFreedom } = models;
  const observations = 2 * models.marks.length;
  const k = params.dragK_perM;
  const aicDrag = aicGaussian(drag.fit.rss, observations, DRAG_MODEL_PARAMETER_COUNT);
  const bicDrag = bicGaussian(drag.fit.rss, observations, DRAG_MODEL_PARAMETER_COUNT);
  const { aic: aicDragFree, bic: bicDragFree } = free.result;
  const kStat = estimate(k, stdErrors.dragK_perM, degreesOfFreedom);
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
  return { dragResolved, dragVerdict, modelComparison: { aicDrag, aicDragFree, bicDrag, bicDragFree } };
}

/** The launch numbers of the model the verdict chose, with their statistical uncertainty only. */
export interface Headline {
  model: FitShotResult['model'];
  launchSpeedMps: number;
  launchSpeedStdErr: number;
  launchSpeedDof: number;
  launchAngleDeg: Estimate;
  x0M: Estimate;
  y0M: Estimate;
  rmsResidualM: number;
}

export function headlineOf(models: FittedModels, judgement: DragJudgement): Headline {
  const { free, params, stdErrors, degreesOfFreedom: dof } = models;
  if (judgement.dragResolved) {
    return {
      model: 'quadratic-drag',
      launchSpeedMps: params.launchSpeedMps,
      launchSpeedStdErr: stdErrors.launchSpeedMps,
      launchSpeedDof: dof,
      launchAngleDeg: estimate(params.launchAngleRad * RAD_TO_DEG, stdErrors.launchAngleRad * RAD_TO_DEG, dof),
      x0M: estimate(params.x0M, stdErrors.x0M, dof),
      y0M: estimate(params.y0M, stdErrors.y0M, dof),
      rmsResidualM: models.rmsResidualM,
    };
  }
  return {
    model: 'drag-free',
    launchSpeedMps: free.result.launchSpeedMps.value,
    launchSpeedStdErr: free.result.launchSpeedMps.stdErr,
    // The parabola has four parameters.
    launchSpeedDof: 2 * models.marks.length - 4,
    launchAngleDeg: free.result.launchAngleDeg,
    x0M: free.result.x0M,
    y0M: free.result.y0M,
    rmsResidualM: free.result.rmsResidualM,
  };
}
