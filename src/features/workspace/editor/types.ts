// Plain data the workspace editor works on. Image coordinates are pixels of
// the full-resolution frame: u to the right, v downwards, (0, 0) at the
// top-left corner of the top-left pixel.

export interface Point {
  u: number;
  v: number;
}

export type TrackKind = 'projectile' | 'muzzle';

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
  /** True when the sub-pixel snap moved the click onto the projectile's centroid. */
  snapped: boolean;
}

export interface FrameInfo {
  frameNumber: number;
  tS: number;
}

/** Scale reference: two end points of something of known length. */
export interface ScaleDraft {
  a: Point;
  b: Point;
  lengthM: number;
  toleranceM: number;
}

/** Camera roll either from two points on a level line or as a stated angle. */
export type LevelDraft = { kind: 'line'; a: Point; b: Point } | { kind: 'angle'; angleDeg: number };

/** Four image points of a known rectangle, in order around it, starting at the corner nearest the origin. */
export interface PlaneDraft {
  corners: [Point, Point, Point, Point];
  widthM: number;
  heightM: number;
}

export interface CalibrationDraft {
  scale: ScaleDraft | null;
  origin: Point | null;
  level: LevelDraft | null;
  plane: PlaneDraft | null;
}

export const EMPTY_CALIBRATION: CalibrationDraft = { scale: null, origin: null, level: null, plane: null };

export type ToolId = 'place' | 'ruler' | 'origin-pin' | 'horizon' | 'plane-fix' | 'hand';

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
