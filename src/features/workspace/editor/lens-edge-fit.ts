// The lens fit the workspace shows before saving: the same plumb-line fit the
// server runs on the saved edges (shared/geometry/plumb-line-fit.ts), with the
// same click σ and the same refusals, in the shape the server returns. Saving
// sends the edges, not these numbers; the server fits them again and its answer
// replaces this preview.
import { CLICK_SIGMA_PX } from '@shared/defaults';
import { coefficientProblem } from '@shared/geometry/lens-distortion';
import { fitPlumbLines, type FrameSize } from '@shared/geometry/plumb-line-fit';
import { GeometryError } from '@shared/geometry/points';
import type { LensDraft, Point } from './types';

export type LensFitOutcome = { ok: true; lens: LensDraft } | { ok: false; message: string };

export function fitLensToEdges(lines: readonly Point[][], frame: FrameSize): LensFitOutcome {
  try {
    const fit = fitPlumbLines(lines, frame, { clickSigmaPx: CLICK_SIGMA_PX });
    const problem = coefficientProblem(fit.coefficients);
    if (problem) return { ok: false, message: `The straight edges fit a distortion no lens this correction describes has (${problem}) Check the clicked points.` };
    const { k1: s1, k2: s2 } = fit.standardUncertainty;
    return {
      ok: true,
      lens: {
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
      },
    };
  } catch (err) {
    // Lines that determine nothing: the plain message the server would answer with.
    if (err instanceof GeometryError) return { ok: false, message: err.message };
    throw err;
  }
}
