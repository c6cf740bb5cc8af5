import type { CameraUncertainties } from './camera-budget';
import type { FreeGravityCheck } from './free-g-check';
// Input and result types of fitShot. Everything here is plain data (numbers,
// strings, booleans, arrays, nulls) so a result survives JSON unchanged.
import type { ScaleInput } from '../geometry/scale-uncertainty';

/**
 * A mark as the fit sees it: capture time and world position. (The API's
 * `Mark` in shared/schemas/marking.ts is the stored mark, with pixels, revision
 * and who placed it.)
 */
export interface FitMark {
  tS: number;
  xM: number;
  yM: number;
  /** Standard uncertainty of this mark's position (both axes), if known. */
  sigmaM?: number;
}

/** A fitted or derived number with its standard uncertainty and 95 % interval. */
export interface Estimate {
  value: number;
  stdErr: number;
  ci95: [number, number];
}

/** Standard uncertainties (one sigma) of the inputs. All optional. */
export interface InputUncertainties {
  massKg?: number;
  diameterM?: number;
  airDensityKgM3?: number;
  /** The scale reference the marks were measured with; its ±tolerance is converted by the GUM rule (a/√3). */
  scale?: ScaleInput;
  /** Alternative to scale: the relative standard uncertainty of the scale factor. */
  scaleRelative?: number;
  /** What the camera and its calibration leave uncertain: lens, plane offset, level (shared/physics/camera-budget.ts). */
  camera?: CameraUncertainties;
}

export interface FitShotInput {
  /**
   * Seconds added to every mark time to reach mid-exposure (shared/physics/exposure-timing.ts:
   * stamped at the start +shutter/2, middle 0, end −shutter/2). Marks keep their stamped times; the fit shifts them.
   */
  exposureShiftS?: number;
  /** Steady along-plane wind, m/s, positive downrange (the shot's wind through shared/physics/wind.ts). */
  windXMps?: number;
  marks: FitMark[];
  massKg: number;
  diameterM: number;
  airDensityKgM3: number;
  uncertainties?: InputUncertainties;
  /** Muzzle position in the same frame as the marks; enables back-extrapolation. */
  muzzle?: { xM: number; yM: number };
  /** Local gravity; default 9.80665 m/s^2. */
  gravityMps2?: number;
  /** Air temperature for Mach and Reynolds numbers; default 288.15 K. */
  airTemperatureK?: number;
}

export type UncertaintySource = 'marking scatter' | 'scale' | 'mass' | 'diameter' | 'air density' | 'lens' | 'plane offset' | 'level';

/** Standard uncertainty contributed by one source (first order, sources independent). */
export interface UncertaintyContribution {
  source: UncertaintySource;
  launchSpeedMps: number;
  dragCoefficient: number;
  /** Standard uncertainty on the launch angle, degrees (absent in fits stored before it was reported). */
  launchAngleDeg?: number;
}

export interface MarkResidual {
  tS: number;
  xResidualM: number;
  yResidualM: number;
  /** Robust outlier flag: |r| > 3.5 x 1.4826 MAD in either axis. */
  outlier: boolean;
}

export interface DragFreeFit {
  x0M: Estimate;
  y0M: Estimate;
  launchSpeedMps: Estimate;
  launchAngleDeg: Estimate;
  rmsResidualM: number;
  /** Gravity fitted freely, a check of time base and scale (should be close to local g). */
  freeGravityMps2: Estimate;
  aic: number;
  bic: number;
}

export interface ModelComparison {
  aicDrag: number;
  aicDragFree: number;
  bicDrag: number;
  bicDragFree: number;
}

export interface DerivedNumbers {
  reynoldsMin: number;
  reynoldsMax: number;
  machMax: number;
  /** m / (Cd A), kg/m^2. Null when Cd is not positive. */
  ballisticCoefficientKgM2: number | null;
  /** 1 / k: the distance over which drag takes a large share of the speed. Null when k is not positive. */
  dragLengthM: number | null;
}

export interface MuzzleResult {
  speedMps: Estimate;
  /** Time of the muzzle crossing relative to the first mark (negative: before it). */
  timeFromFirstMarkS: number;
  /** Fitted path height at the muzzle x minus the given muzzle height. */
  heightMissM: number;
}

export interface FitShotResult {
  /** Model the headline numbers come from: drag model when drag is resolved, else the drag-free fit. */
  model: 'quadratic-drag' | 'drag-free';
  /** Time the launch state refers to (the first mark). */
  tRefS: number;
  x0M: Estimate;
  y0M: Estimate;
  launchSpeedMps: Estimate;
  launchAngleDeg: Estimate;
  dragK_perM: Estimate;
  dragCoefficient: Estimate;
  rmsResidualM: number;
  dragResolved: boolean;
  dragVerdict: string;
  degreesOfFreedom: number;
  /** Parameter order of the correlation matrix. */
  parameterNames: string[];
  correlation: number[][];
  residuals: MarkResidual[];
  outlierCount: number;
  modelComparison: ModelComparison;
  dragFree: DragFreeFit;
  uncertaintyBreakdown: UncertaintyContribution[];
  derived: DerivedNumbers;
  muzzle: MuzzleResult | null;
  cautions: string[];
  iterations: number;
  converged: boolean;
  /** Seconds the mark times were moved to reach mid-exposure (0: none stated). */
  exposureShiftS?: number;
  /** The drag model fitted with gravity left free: a check of the frame rate and the scale. */
  gravityCheck?: FreeGravityCheck | null;
}
