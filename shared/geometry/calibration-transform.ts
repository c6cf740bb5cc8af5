import { applyHomography, invertHomography, solveHomography, type Homography } from './homography';
import type { Downrange, LevelInput, PlaneCorrectionInput, ScaleReference } from '../schemas/marking';
import { GeometryError, distancePx, type PixelPoint, type WorldPoint } from './points';
import { scaleWithUncertainty } from './scale-uncertainty';
import { CLICK_SIGMA_PX } from '../defaults';
import { coefficientProblem, distort, lensModelForFrame, undistort, type LensModel, type RadialCoefficients } from './lens-distortion';
import { planeOffsetFactor, type PlaneOffsetInput, type PlaneOffsetResult } from './plane-offset';
import { correctedLevelLineRollSigmaRad, statedRollSigmaRad } from './roll-uncertainty';

// Frame pixels → world metres, in this order (docs/marking-api.md, "Coordinates"):
//   0. optional lens correction: undo the radial distortion about the frame
//      centre (lens-distortion.ts), so straight lines are straight again;
//   1. optional plane correction: q = H·p into a view square to the flight plane
//      ("rectified pixels", still u right / v down);
//   2. subtract the origin (also rectified) and flip v so y points up;
//   3. undo the camera roll (rotate by −roll);
//   4. divide by pixels per metre (measured in rectified pixels, then moved
//      from the scale reference's depth to the flight plane's, plane-offset.ts);
//   5. mirror x when the shot flies to the left on screen.

/** A calibration as the transform needs it: the wire types of shared/schemas/marking.ts, defaults applied. */
export interface CalibrationGeometry {
  scale: ScaleReference;
  origin: PixelPoint;
  level: LevelInput;
  downrange: Downrange;
  /** Corners as a list, so stored records (JSON arrays) fit; the request schema pins them to four. */
  plane: (Omit<PlaneCorrectionInput, 'corners'> & { corners: readonly PixelPoint[] }) | null;
  /** Radial lens correction and the frame size its normalised radius refers to; absent or null: an ideal lens. */
  lens?: CalibrationLens | null;
  /** Camera-to-plane distance and the scale reference's offset from the plane; absent or null: the reference lies in the plane. */
  planeOffset?: PlaneOffsetInput | null;
  /** How well the level is known: click σ of a level line's end points (default: the usual click σ), ± tolerance of a stated roll (default 0). */
  levelUncertainty?: { endpointSigmaPx?: number; rollTolDeg?: number } | null;
}

export interface CalibrationLens extends RadialCoefficients {
  frameWidthPx: number;
  frameHeightPx: number;
}

export interface CalibrationTransform {
  pixelsPerMetre: number;
  scaleRelUncertainty: number;
  rollDeg: number;
  /** Lens-corrected pixels → rectified pixels; null without plane correction. */
  homography: number[] | null;
  /** The lens model undone in step 0; null for an ideal lens. */
  lens: LensModel | null;
  /** Scale moved from the reference's depth to the flight plane's; null when no offset was stated. */
  planeOffset: PlaneOffsetResult | null;
  /** Standard uncertainty of the roll, radians (level line clicks through the corrections, or a stated tolerance). */
  rollStdUncertaintyRad: number;
  /** Steps 0–1: frame pixels → corrected (undistorted, rectified) pixels. */
  correct(p: PixelPoint): PixelPoint;
  imageToWorld(p: PixelPoint): WorldPoint;
  worldToImage(w: WorldPoint): PixelPoint;
}

/**
 * Roll, degrees counter-clockwise on screen, of a line that is level in the
 * world. Screen "up" is −v, so the angle is atan2(−Δv, Δu); folded into
 * (−90°, 90°] so the order of the two clicks does not matter.
 */
export function rollFromLevelLine(p1: PixelPoint, p2: PixelPoint): number {
  let deg = (Math.atan2(-(p2.v - p1.v), p2.u - p1.u) * 180) / Math.PI;
  if (deg > 90) deg -= 180;
  if (deg <= -90) deg += 180;
  return deg;
}

export interface Similarity {
  origin: PixelPoint;
  pixelsPerMetre: number;
  rollRad: number;
  mirrorX: boolean;
}

/** Steps 2–5 above: rectified pixels → metres. */
export function similarityToWorld({ origin, pixelsPerMetre, rollRad, mirrorX }: Similarity, q: PixelPoint): WorldPoint {
  const du = q.u - origin.u;
  const dy = -(q.v - origin.v);
  const c = Math.cos(rollRad);
  const s = Math.sin(rollRad);
  const x = (c * du + s * dy) / pixelsPerMetre;
  const y = (-s * du + c * dy) / pixelsPerMetre;
  return { x: mirrorX ? -x : x, y };
}

/** Exact inverse of similarityToWorld. */
export function similarityToImage({ origin, pixelsPerMetre, rollRad, mirrorX }: Similarity, w: WorldPoint): PixelPoint {
  const x = (mirrorX ? -w.x : w.x) * pixelsPerMetre;
  const y = w.y * pixelsPerMetre;
  const c = Math.cos(rollRad);
  const s = Math.sin(rollRad);
  const du = c * x - s * y;
  const dy = s * x + c * y;
  return { u: origin.u + du, v: origin.v - dy };
}

/**
 * Where the rectangle's corners land in rectified pixels: its own shape in
 * metres times k, k being its mean image scale (perimeter in px / perimeter
 * in m), so rectified pixels stay close in size to frame pixels.
 */
function rectifiedCorners(corners: readonly PixelPoint[], widthM: number, heightM: number): PixelPoint[] {
  const perimeterPx = corners.reduce((s, p, i) => s + distancePx(p, corners[(i + 1) % 4]), 0);
  const k = perimeterPx / (2 * (widthM + heightM));
  return [
    { u: 0, v: 0 },
    { u: widthM * k, v: 0 },
    { u: widthM * k, v: heightM * k },
    { u: 0, v: heightM * k },
  ];
}

/** Shoelace signed area (sign = winding direction on screen). */
function signedArea(points: readonly PixelPoint[]): number {
  return points.reduce((s, p, i) => s + p.u * points[(i + 1) % points.length].v - points[(i + 1) % points.length].u * p.v, 0) / 2;
}

export function buildCalibrationTransform(geometry: CalibrationGeometry): CalibrationTransform {
  const { scale, origin, level, downrange, plane } = geometry;
  let lens: LensModel | null = null;
  if (geometry.lens) {
    const problem = coefficientProblem(geometry.lens);
    if (problem) throw new GeometryError(problem, 'lens.coefficients');
    lens = lensModelForFrame(geometry.lens.frameWidthPx, geometry.lens.frameHeightPx, geometry.lens);
  }
  const lensModel = lens;
  const undist = (p: PixelPoint) => (lensModel ? undistort(lensModel, p) : p);
  const offset = geometry.planeOffset ? planeOffsetFactor(geometry.planeOffset) : null;
  if (distancePx(scale.p1, scale.p2) < 1) throw new GeometryError('Scale end points must be at least 1 px apart.', 'scale.p2');
  if (!(scale.lengthM > 0)) throw new GeometryError('Scale length must be positive.', 'scale.lengthM');
  if (!(scale.lengthTolM >= 0 && scale.lengthTolM < scale.lengthM)) {
    throw new GeometryError('Length tolerance must be 0 or more and smaller than the length.', 'scale.lengthTolM');
  }

  let homography: number[] | null = null;
  if (plane) {
    if (!(plane.widthM > 0 && plane.heightM > 0)) throw new GeometryError('Rectangle width and height must be positive.', 'plane');
    const corners = plane.corners.map(undist);
    const target = rectifiedCorners(corners, plane.widthM, plane.heightM);
    // A mirrored corner order would still solve, but would flip the world left-right.
    if (Math.sign(signedArea(corners)) !== Math.sign(signedArea(target))) {
      throw new GeometryError('The corners are in mirror order: give them as top-left, top-right, bottom-right, bottom-left.', 'plane.corners');
    }
    homography = solveHomography(corners, target);
  }
  const h = homography;
  const rectify = (p: PixelPoint) => (h ? applyHomography(h, undist(p)) : undist(p));
  const inverse: Homography | null = h ? invertHomography(h) : null;
  const unrectify = (q: PixelPoint) => {
    const p = inverse ? applyHomography(inverse, q) : q;
    return lensModel ? distort(lensModel, p) : p;
  };

  const s1 = rectify(scale.p1);
  const s2 = rectify(scale.p2);
  const lengthPx = distancePx(s1, s2);
  if (!(lengthPx >= 1e-6)) throw new GeometryError('Scale end points coincide after plane correction.', 'scale');
  // σ of a click is in frame pixels; to first order the correction stretches it as it stretches the reference.
  const stretch = lengthPx / distancePx(scale.p1, scale.p2);
  const scaleResult = scaleWithUncertainty({
    lengthPx,
    lengthM: scale.lengthM,
    lengthTolM: scale.lengthTolM,
    endpointSigmaPx: scale.endpointSigmaPx * stretch,
  });

  let rollDeg: number;
  let rollStdUncertaintyRad: number;
  const lu = geometry.levelUncertainty;
  if (level.kind === 'line') {
    if (distancePx(level.p1, level.p2) < 1) throw new GeometryError('Level line points must be at least 1 px apart.', 'level.p2');
    rollDeg = rollFromLevelLine(rectify(level.p1), rectify(level.p2));
    rollStdUncertaintyRad = correctedLevelLineRollSigmaRad(level.p1, level.p2, lu?.endpointSigmaPx ?? CLICK_SIGMA_PX, rectify);
  } else {
    rollDeg = level.rollDeg;
    rollStdUncertaintyRad = statedRollSigmaRad(lu?.rollTolDeg ?? 0);
  }

  const similarity: Similarity = {
    origin: rectify(origin),
    pixelsPerMetre: scaleResult.pixelsPerMetre * (offset ? offset.factor : 1),
    rollRad: (rollDeg * Math.PI) / 180,
    mirrorX: downrange === 'left',
  };

  return {
    pixelsPerMetre: similarity.pixelsPerMetre,
    scaleRelUncertainty: scaleResult.relStdUncertainty,
    rollDeg,
    homography,
    lens: lensModel,
    planeOffset: offset,
    rollStdUncertaintyRad,
    correct: rectify,
    imageToWorld: (p) => similarityToWorld(similarity, rectify(p)),
    worldToImage: (w) => unrectify(similarityToImage(similarity, w)),
  };
}
