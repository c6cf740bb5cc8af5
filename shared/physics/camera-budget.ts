// Budget rows for what the camera and its calibration leave uncertain: the
// lens correction, the scale reference's offset from the flight plane, and
// the level (roll). Each row gives the standard uncertainty it puts on the
// headline launch speed, launch angle and on k (Cd follows k one to one).
//
// - plane offset: a change of scale (plane-offset.ts). With gravity fixed a
//   scaled path is the path under a scaled g, so the fit moves the angle and k
//   as well as the speed: propagated as a shift like the others (the same rule
//   serves the scale reference's own row, scaleRow below);
// - level: every mark turned about the origin by σ_roll (roll-uncertainty.ts),
//   propagated through the fits to first order (systematic-shift.ts);
// - lens: each independent 1σ step of the coefficients moves the marks by a
//   pattern computed from the pixels (lens-shifts.ts), propagated the same way.
import type { LeastSquaresResult } from './least-squares';
import {
  combineShifts, dragFitShift, dragFreeShift, rollMarkShift, scaleMarkShift, type HeadlineShift, type MarkShift,
} from './systematic-shift';
import type { FitMark } from './types';

export interface CameraUncertainties {
  /** Relative standard uncertainty of the plane-offset factor (D − δ)/D. */
  planeOffsetRel?: number;
  /** Standard uncertainty of the roll, radians (clicked level line or stated roll). */
  rollSigmaRad?: number;
  /** Independent 1σ components of the lens correction's effect on the marks. */
  lensShifts?: MarkShift[];
}

export type CameraSource = 'lens' | 'plane offset' | 'level' | 'scale';

export interface CameraRow {
  source: CameraSource;
  launchSpeedMps: number;
  launchAngleDeg: number;
  dragK_perM: number;
  /** Relative standard uncertainty on any fitted speed (for the muzzle speed), where the source acts as a scale. */
  speedRel: number;
}

export interface CameraBudgetInput {
  marks: readonly FitMark[];
  /** The quadratic-drag fit (its Jacobian at the solution). */
  dragFit: LeastSquaresResult;
  /** Whether the headline numbers come from the drag model (else the drag-free parabola). */
  dragResolved: boolean;
  /** Drag-free launch velocity at tRefS, for the drag-free headline. */
  dragFreeVelocity: { vxMps: number; vyMps: number };
  tRefS: number;
  headlineSpeedMps: number;
  dragK_perM: number;
  camera: CameraUncertainties;
}

/** A row for a source that acts as a change of scale with relative standard uncertainty rel. */
export function scaleLikeRow(input: CameraBudgetInput, source: CameraSource, rel: number): CameraRow {
  const c = combineShifts([responseTo(input, scaleMarkShift(input.marks, rel))]);
  return { source, ...c, speedRel: rel };
}

function responseTo(input: CameraBudgetInput, shift: MarkShift): HeadlineShift {
  const drag = dragFitShift(input.dragFit, input.marks, shift);
  if (input.dragResolved) return drag;
  // Speed and angle from the headline model; k always from the drag fit.
  const free = dragFreeShift(input.marks, input.tRefS, input.dragFreeVelocity, shift);
  return { launchSpeedMps: free.launchSpeedMps, launchAngleDeg: free.launchAngleDeg, dragK_perM: drag.dragK_perM };
}

export function cameraRows(input: CameraBudgetInput): CameraRow[] {
  const { camera } = input;
  const rows: CameraRow[] = [];
  if (camera.lensShifts && camera.lensShifts.length > 0) {
    const c = combineShifts(camera.lensShifts.map((s) => responseTo(input, s)));
    const speedRel = input.headlineSpeedMps !== 0 ? c.launchSpeedMps / Math.abs(input.headlineSpeedMps) : 0;
    rows.push({ source: 'lens', ...c, speedRel });
  }
  if (camera.planeOffsetRel !== undefined && camera.planeOffsetRel > 0) {
    rows.push(scaleLikeRow(input, 'plane offset', camera.planeOffsetRel));
  }
  if (camera.rollSigmaRad !== undefined && camera.rollSigmaRad > 0) {
    const c = combineShifts([responseTo(input, rollMarkShift(input.marks, camera.rollSigmaRad))]);
    rows.push({ source: 'level', ...c, speedRel: 0 });
  }
  return rows;
}
