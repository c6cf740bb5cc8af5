// The lens fit the workspace shows before saving: the same plumb-line fit the
// server runs on the saved edges (shared/geometry/lens-from-edges.ts), with the
// same click σ and the same refusals, in the shape the server returns. Saving
// sends the edges, not these numbers; the server fits them again and its answer
// replaces this preview.
import { CLICK_SIGMA_PX } from '@shared/defaults';
import { lensFromStraightEdges } from '@shared/geometry/lens-from-edges';
import type { FrameSize } from '@shared/geometry/plumb-line-fit';
import { GeometryError } from '@shared/geometry/points';
import type { LensDraft, Point } from './types';

export type LensFitOutcome = { ok: true; lens: LensDraft } | { ok: false; message: string };

export function fitLensToEdges(lines: readonly Point[][], frame: FrameSize): LensFitOutcome {
  try {
    return { ok: true, lens: lensFromStraightEdges(lines, frame, CLICK_SIGMA_PX) };
  } catch (err) {
    // Lines that determine nothing: the plain message the server would answer with.
    if (err instanceof GeometryError) return { ok: false, message: err.message };
    throw err;
  }
}
