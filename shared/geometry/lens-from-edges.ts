// The lens correction fitted from clicked straight edges (plumb-line method,
// ./plumb-line-fit.ts), in the shape a calibration stores. One function for the
// workspace's preview and the server's stored fit, so both refuse the same
// edges with the same words and report the same numbers.
import type { LensCorrection } from '../schemas/camera';
import { coefficientProblem } from './lens-distortion';
import { fitPlumbLines, type FrameSize } from './plumb-line-fit';
import { GeometryError, type PixelPoint } from './points';

/** Throws GeometryError (field `lens.straightLines`) for edges that determine nothing or fit a folding lens. */
export function lensFromStraightEdges(lines: readonly (readonly PixelPoint[])[], frame: FrameSize, clickSigmaPx?: number): LensCorrection {
  const fit = fitPlumbLines(lines, frame, clickSigmaPx !== undefined ? { clickSigmaPx } : {});
  const problem = coefficientProblem(fit.coefficients);
  if (problem) {
    throw new GeometryError(`The straight edges fit a distortion no lens this correction describes has (${problem}) Check the clicked points.`, 'lens.straightLines');
  }
  const { k1: s1, k2: s2 } = fit.standardUncertainty;
  return {
    model: fit.model,
    source: 'straight-lines',
    k1: fit.coefficients.k1,
    k2: fit.coefficients.k2,
    k1StdUnc: s1,
    k2StdUnc: s2,
    k1k2Correlation: s1 > 0 && s2 > 0 ? fit.covariance[0][1] / (s1 * s2) : 0,
    residualRmsPx: fit.residualRmsPx,
    terms: fit.terms,
    straightLines: lines.map((l) => l.map((p) => ({ u: p.u, v: p.v }))),
    notes: fit.notes,
    frameWidthPx: frame.widthPx,
    frameHeightPx: frame.heightPx,
  };
}
