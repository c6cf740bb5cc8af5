// A mark's time and world position: pixels through the clip's calibration
// (buildCalibrationTransform(...).imageToWorld, the one pixel→world mapping:
// plane homography, origin, roll, scale, downrange sign) and frame through
// frameTimeS. The marks API, the fit input and the editor's preview of marks
// not yet saved all use this, so a mark has one (t, x, y) everywhere.
import type { CalibrationTransform } from '../geometry/calibration-transform';

export interface PixelMark {
  frameNumber: number;
  uPx: number;
  vPx: number;
}

export interface MarkTimeAndPlace {
  /** Capture time, s; null when the clip has neither a frame table time nor a capture rate. */
  tS: number | null;
  /** World position, m; null when the clip is not calibrated. */
  xM: number | null;
  yM: number | null;
}

export function markTimeAndPlace(
  mark: PixelMark,
  transform: CalibrationTransform | null,
  frameTime: (frameNumber: number) => number | null,
): MarkTimeAndPlace {
  const world = transform ? transform.imageToWorld({ u: mark.uPx, v: mark.vPx }) : null;
  return { tS: frameTime(mark.frameNumber), xM: world ? world.x : null, yM: world ? world.y : null };
}
