// The lens correction a calibration stores: fitted from clicked straight edges
// (plumb-line method, shared/geometry/plumb-line-fit.ts) or taken from known
// coefficients (a lens profile measured once). Either way it is checked before
// anything is stored: edges that determine nothing and coefficients that fold
// the picture are refused with a plain message naming the field.
import type { z } from 'zod';
import { coefficientProblem } from '../../shared/geometry/lens-distortion';
import { lensFromStraightEdges } from '../../shared/geometry/lens-from-edges';
import type { FrameSize } from '../../shared/geometry/plumb-line-fit';
import { GeometryError } from '../../shared/geometry/points';
import type { LensCorrection, LensInput } from '../../shared/schemas/camera';

export function lensCorrectionOf(input: z.output<typeof LensInput> | null, frame: FrameSize): LensCorrection | null {
  if (!input) return null;
  const frameSize = { frameWidthPx: frame.widthPx, frameHeightPx: frame.heightPx };
  if (input.straightLines) return lensFromStraightEdges(input.straightLines, frame, input.clickSigmaPx);
  const c = input.coefficients;
  if (!c) return null;
  const problem = coefficientProblem(c);
  if (problem) throw new GeometryError(problem, 'lens.coefficients');
  return {
    model: 'brown-conrady-radial',
    source: 'coefficients',
    k1: c.k1,
    k2: c.k2,
    k1StdUnc: c.k1StdUnc,
    k2StdUnc: c.k2StdUnc,
    k1k2Correlation: c.k1k2Correlation,
    residualRmsPx: null,
    terms: null,
    straightLines: null,
    notes: [],
    ...frameSize,
  };
}

/** The coefficients' covariance [[u1², ρ u1 u2], [ρ u1 u2, u2²]]. */
export function lensCovariance(l: LensCorrection): [[number, number], [number, number]] {
  const c = l.k1k2Correlation * l.k1StdUnc * l.k2StdUnc;
  return [[l.k1StdUnc ** 2, c], [c, l.k2StdUnc ** 2]];
}
