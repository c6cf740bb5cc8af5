// Stage 6 of fitShot: plain-words cautions about the fit itself.
import { SPHERE_SUBCRITICAL_CD } from '../handbook-drag';
import type { FittedModels } from './fit-models';
import type { DragJudgement } from './judge-drag';

export function fitCautions(models: FittedModels, judgement: DragJudgement, dragCoefficient: number): string[] {
  const cautions: string[] = [];
  const g = models.gravityMps2;
  if (!models.drag.fit.converged) cautions.push('The drag fit stopped at its iteration limit before meeting its convergence test.');
  if (models.outlierCount > 0) {
    cautions.push(`${models.outlierCount} mark(s) lie more than 3.5 robust standard deviations from the fitted path; check them.`);
  }
  // The free-g parabola checks time base and scale only when drag is negligible;
  // with resolved drag its g absorbs the drag and says nothing about the clip.
  const gFree = models.free.result.freeGravityMps2;
  if (!judgement.dragResolved && Math.abs(gFree.value - g) > 3 * gFree.stdErr && Math.abs(gFree.value / g - 1) > 0.02) {
    cautions.push(
      `A drag-free fit with free gravity gives g = ${gFree.value.toFixed(3)} m/s^2 (expected ${g}): ` +
        'this points at a wrong frame rate or scale.',
    );
  }
  if (models.params.dragK_perM > 0 && judgement.dragResolved) {
    const cdRatio = dragCoefficient / SPHERE_SUBCRITICAL_CD;
    if (cdRatio > 3 || cdRatio < 0.1) {
      cautions.push(`Cd = ${dragCoefficient.toPrecision(3)} is far from handbook values for compact bodies (0.1 to 1.2); check mass, diameter and scale.`);
    }
  }
  return cautions;
}
