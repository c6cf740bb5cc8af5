// Stage 5 of fitShot: follow the chosen model back (or on) to the muzzle's x
// and give the speed there with its own interval.
import { DRAG_PARAM, dragParamVector } from '../drag-fit';
import { combinedEstimate, RAD_TO_DEG } from '../estimate';
import { muzzleCrossing, muzzleSpeedGradient } from '../muzzle';
import type { FitShotInput, MuzzleResult } from '../types';
import type { FittedModels } from './fit-models';
import type { DragJudgement } from './judge-drag';
import { systematicSpeedUncertainties, type UncertaintyBudget } from './uncertainty-budget';

export interface MuzzleStage {
  muzzle: MuzzleResult | null;
  cautions: string[];
}

function quadForm(g: number[], cov: number[][]): number {
  let s = 0;
  for (let a = 0; a < g.length; a++) for (let b = 0; b < g.length; b++) s += g[a] * cov[a][b] * g[b];
  return s;
}

export function muzzleStage(input: FitShotInput, models: FittedModels, judgement: DragJudgement, budget: UncertaintyBudget): MuzzleStage {
  if (!input.muzzle) return { muzzle: null, cautions: [] };
  const { drag, free, gravityMps2: g } = models;
  const { dragResolved } = judgement;
  const [freeX0, freeY0] = free.state;
  // Drag not resolved: the drag-free launch state with k = 0, in the drag-fit parameter order.
  const params = dragResolved
    ? drag.fit.params
    : dragParamVector({
      x0M: freeX0,
      y0M: freeY0,
      launchSpeedMps: free.result.launchSpeedMps.value,
      launchAngleRad: free.result.launchAngleDeg.value / RAD_TO_DEG,
      dragK_perM: 0,
    });
  const crossing = muzzleCrossing(params, g, input.muzzle.xM);
  const typical = dragParamVector({
    x0M: 1, y0M: 1, launchSpeedMps: Math.max(models.params.launchSpeedMps, 1), launchAngleRad: 0.1, dragK_perM: models.typicalK_perM,
  });
  const grad = crossing ? muzzleSpeedGradient(params, g, input.muzzle.xM, typical) : null;
  if (!crossing || !grad) {
    return { muzzle: null, cautions: ['The fitted path never reaches the muzzle x position within 10 s, so no muzzle speed is given.'] };
  }
  // The statistical part comes from the drag fit's covariance (drag-free: k held at zero).
  if (!dragResolved) grad[DRAG_PARAM.dragK_perM] = 0;
  const statSe = Math.sqrt(quadForm(grad, drag.fit.covariance));
  const muzzle: MuzzleResult = {
    speedMps: combinedEstimate(crossing.speedMps, statSe, models.degreesOfFreedom, systematicSpeedUncertainties(budget, crossing.speedMps)),
    timeFromFirstMarkS: crossing.dtS,
    heightMissM: crossing.yM - input.muzzle.yM,
  };
  const cautions: string[] = [];
  if (Math.abs(muzzle.heightMissM) > Math.max(0.05, 10 * models.rmsResidualM)) {
    cautions.push(
      `The fitted path passes ${Math.abs(muzzle.heightMissM).toFixed(3)} m ${muzzle.heightMissM > 0 ? 'above' : 'below'} ` +
        'the given muzzle position: check the muzzle mark and the scale.',
    );
  }
  return { muzzle, cautions };
}
