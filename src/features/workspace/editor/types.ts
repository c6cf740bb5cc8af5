// Plain data the workspace editor works on. Image coordinates are pixels of
// the full-resolution frame: u to the right, v downwards, (0, 0) at the
// top-left corner of the top-left pixel.

import type { PixelPoint } from '@shared/geometry/points';
import type { MarkSource } from '@shared/schemas/auto-mark';
import type { LensCorrection } from '@shared/schemas/camera';
import type { Downrange, LevelInput, PlaneCorrectionInput, ScaleReference, TrackKind } from '@shared/schemas/marking';

/** The editor's short name for the one pixel point type. */
export type Point = PixelPoint;
export type { TrackKind };

export interface EditorTrack {
  id: string;
  kind: TrackKind;
  label: string;
}

export interface EditorMark {
  trackId: string;
  frameNumber: number;
  uPx: number;
  vPx: number;
  /** Where the person clicked or dragged to, before any snap. */
  placedUPx: number;
  placedVPx: number;
  /** True when the sub-pixel snap moved the click onto the projectile's centroid. */
  snapped: boolean;
  /** Who placed it, as the server says ('auto': the automatic marker); absent on a mark this person just placed. */
  source?: MarkSource;
  /** The automatic marker's confidence, 0 … 1; null or absent for a person's mark. */
  confidence?: number | null;
  lowConfidenceReason?: string | null;
}

export interface FrameInfo {
  frameNumber: number;
  tS: number;
}

/** Scale reference as drawn (the click uncertainty is added when the draft is saved). */
export type ScaleDraft = Omit<ScaleReference, 'endpointSigmaPx'>;
export type LevelDraft = LevelInput;
export type PlaneDraft = PlaneCorrectionInput;
/** The lens correction in use, in the shape the server returns it (fitted here for a preview, or as saved). */
export type LensDraft = LensCorrection;

/** Camera distance to the flight plane and the scale reference's offset from it (positive towards the camera), each ± a tolerance. */
export interface PlaneOffsetDraft {
  planeDistanceM: number;
  planeDistanceTolM: number;
  referenceOffsetM: number;
  referenceOffsetTolM: number;
}

/** Click σ of a level line's end points, or the ± tolerance of a stated roll; absent: the usual defaults. */
export interface LevelUncertaintyDraft {
  endpointSigmaPx?: number;
  rollTolDeg?: number;
}

export interface CalibrationDraft {
  scale: ScaleDraft | null;
  origin: Point | null;
  level: LevelDraft | null;
  plane: PlaneDraft | null;
  /** Which way the shot flies on screen. */
  downrange: Downrange;
  /** Edges straight in the world, clicked with the straight-edge tool (frame pixels), waiting to be fitted or already fitted. */
  straightLines: Point[][];
  /** Lens correction; null: an ideal lens. */
  lens: LensDraft | null;
  /** Null: the scale reference is taken to lie in the flight plane. */
  planeOffset: PlaneOffsetDraft | null;
  levelUncertainty: LevelUncertaintyDraft | null;
}

export const EMPTY_CALIBRATION: CalibrationDraft = {
  scale: null,
  origin: null,
  level: null,
  plane: null,
  downrange: 'right',
  straightLines: [],
  lens: null,
  planeOffset: null,
  levelUncertainty: null,
};

export type ToolId = 'place' | 'ruler' | 'origin-pin' | 'horizon' | 'plane-fix' | 'straight-edge' | 'hand';

/** How the frame sits on screen: screen = image * zoom + pan (CSS pixels). */
export interface ViewTransform {
  zoom: number;
  panX: number;
  panY: number;
}

export type MarkKey = `${string}@${number}`;

export function markKey(trackId: string, frameNumber: number): MarkKey {
  return `${trackId}@${frameNumber}`;
}
