// Marks whose residual from the live preview curve is out of line with the
// others: robust outlier flags from the physics core (3.5 robust sigma about
// the median, shared/physics/outliers.ts), with a floor of one frame pixel so
// near-perfect automatic marks do not flag rounding noise.
import { flagOutliers } from '@shared/physics/outliers';
import type { FitMark } from '@shared/physics/types';
import type { FlightPreview, WorldPathPoint } from './flight-preview';

export interface PreviewResidual {
  tS: number;
  rxM: number;
  ryM: number;
  outOfLine: boolean;
}

/** Position on a sampled path at time t (linear between samples; the samples are dense). */
export function pathAt(path: WorldPathPoint[], tS: number): { xM: number; yM: number } | null {
  if (path.length === 0 || tS < path[0].tS - 1e-12 || tS > path[path.length - 1].tS + 1e-12) return null;
  let i = 1;
  while (i < path.length - 1 && path[i].tS < tS) i++;
  const a = path[i - 1];
  const b = path[i];
  const f = b.tS === a.tS ? 0 : (tS - a.tS) / (b.tS - a.tS);
  return { xM: a.xM + f * (b.xM - a.xM), yM: a.yM + f * (b.yM - a.yM) };
}

/**
 * Residuals of the marks from the preview's drag curve (the drag-free one when
 * the drag fit did not converge). `onePixelM`: one frame pixel in metres.
 */
export function previewResiduals(marks: FitMark[], preview: FlightPreview | null, onePixelM: number): PreviewResidual[] {
  if (!preview || marks.length === 0) return [];
  const path = preview.drag?.path ?? preview.dragFree.path;
  const residuals = marks.map((m) => {
    const p = pathAt(path, m.tS);
    return { tS: m.tS, rxM: p ? m.xM - p.xM : 0, ryM: p ? m.yM - p.yM : 0 };
  });
  const flags = flagOutliers(residuals.map((r) => r.rxM), residuals.map((r) => r.ryM));
  return residuals.map((r, i) => ({ ...r, outOfLine: flags[i] && Math.hypot(r.rxM, r.ryM) > onePixelM }));
}
