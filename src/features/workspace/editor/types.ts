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
  /** Where the person clicked or dragged to, before any snap. */
  placedUPx: number;
  placedVPx: number;
  /** True when the sub-pixel snap moved the click onto the projectile's centroid. */
  snapped: boolean;
}

export interface FrameInfo {
  frameNumber: number;
  tS: number;
}

/** Scale reference: two end points of something of known length. */
export interface ScaleDraft {
  p1: Point;
  p2: Point;
  lengthM: number;
  /** Stated tolerance ±a of the length. */
  lengthTolM: number;
}

/** Camera roll either from two points on a level line or as a stated angle. */
export type LevelDraft = { kind: 'line'; p1: Point; p2: Point } | { kind: 'angle'; rollDeg: number };

/** Four image points of a known rectangle in the flight plane: top-left, top-right, bottom-right, bottom-left as it stands. */
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
  /** Which way the shot flies on screen. */
  downrange: 'right' | 'left';
}

export const EMPTY_CALIBRATION: CalibrationDraft = { scale: null, origin: null, level: null, plane: null, downrange: 'right' };

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
