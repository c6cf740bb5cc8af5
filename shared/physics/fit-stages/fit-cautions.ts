// Stage 6 of fitShot: plain-words cautions about the fit itself.
import { SPHERE_SUBCRITICAL_CD } from '../handbook-drag';
import { freeGravityCheck, type FreeGravityCheck } from '../free-g-check';
import type { FitShotInput } from '../types';
import type { FittedModels } from './fit-models';
import type { DragJudgement } from './judge-drag';
import type { UncertaintyBudget } from './uncertainty-budget';

export interface FitCautions {
  cautions: string[];
  /** The six-parameter free-g fit behind the time-base caution; null when it could not be run. */
  gravityCheck: FreeGravityCheck | null;
}

export function fitCautions(
  input: FitShotInput, models: FittedModels, judgement: DragJudgement, dragCoefficient: number, budget: UncertaintyBudget,
): FitCautions {
  const cautions: string[] = [];
  const g = models.gravityMps2;
  if (!models.drag.fit.converged) cautions.push('The drag fit stopped at its iteration limit before meeting its convergence test.');
  if (models.outlierCount > 0) {
    cautions.push(`${models.outlierCount} mark(s) lie more than 3.5 robust standard deviations from the fitted path; check them.`);
  }
  // Time base and scale: g fitted freely inside the drag model (free-g-check.ts).
  // It replaces the drag-free parabola's free g, which absorbs drag and sits far
  // from 9.81 on any draggy shot. What moves g like a scale error (scale, plane
  // offset, lens) widens what counts as far.
  let gravityCheck: FreeGravityCheck | null = null;
  if (models.marks.length * 2 > 6) {
    const scaleRel = Math.hypot(...budget.rows.slice(1).map((r) => r.speedRel));
    try {
      gravityCheck = freeGravityCheck(models.marks, {
        statedGravityMps2: g,
        start: models.drag.fit.params as [number, number, number, number, number],
        typicalK_perM: models.typicalK_perM,
        windXMps: input.windXMps ?? 0,
        scaleRelUncertainty: scaleRel,
      });
    } catch {
      gravityCheck = null;
    }
    if (gravityCheck?.caution) cautions.push(gravityCheck.caution);
  }
  if (input.uncertainties?.camera && input.uncertainties.camera.planeOffsetRel === undefined) {
    cautions.push(
      'No distance to the flight plane or offset of the scale reference was stated, so the reference is assumed to lie in the flight plane; ' +
        'a reference 10 cm nearer the camera than the flight, seen from 10 m, makes every length 1 % short.',
    );
  }
  if (models.params.dragK_perM > 0 && judgement.dragResolved) {
    const cdRatio = dragCoefficient / SPHERE_SUBCRITICAL_CD;
    if (cdRatio > 3 || cdRatio < 0.1) {
      cautions.push(`Cd = ${dragCoefficient.toPrecision(3)} is far from handbook values for compact bodies (0.1 to 1.2); check mass, diameter and scale.`);
    }
  }
  return { cautions, gravityCheck };
}
