// Radial lens distortion about the image centre.
//
// Model: Brown–Conrady with two radial terms, k1 and k2 (Brown, "Decentering
// distortion of lenses", Photogrammetric Engineering 32(3), 1966; the same
// radial part as OpenCV's camera model, docs.opencv.org "Camera Calibration and
// 3D Reconstruction"). An ideal (undistorted) point at normalised radius r is
// seen at
//     r_d = r · (1 + k1 r² + k2 r⁴)
// along the same ray from the centre. Why this model and not the one-parameter
// division model: it is the model OpenCV implements, so every number here can be
// checked against OpenCV directly (the tests do, to 0.01 px); two terms follow
// the strong barrel of wide action-camera lenses out to the corners, where one
// division term leaves a visible bow; and a lens profile measured elsewhere
// (OpenCV, most calibration tools) arrives as k1, k2 and can be entered as is.
// Tangential terms (p1, p2) are left out: phone and action-camera lenses are
// well centred, and clicked straight lines cannot separate them from the roll
// and plane correction that follow.
//
// Normalised radius convention: pixel offsets from the image centre divided by
// the half-diagonal of the frame, so a corner of the frame sits at r = 1 whatever
// the resolution. In OpenCV terms the camera matrix is
//     [[R, 0, cu], [0, R, cv], [0, 0, 1]],  R = half-diagonal in px,
// with distortion coefficients [k1, k2, 0, 0, 0].
//
// distort() maps an ideal pixel to where the lens shows it (closed form);
// undistort() maps a clicked pixel back to its ideal position by Newton's
// method on the radius (the radial polynomial is solved exactly, not by
// OpenCV's fixed-point loop, so the round trip is exact to rounding).
import { GeometryError, type PixelPoint } from './points';

export interface RadialCoefficients {
  /** Coefficient of r² (negative: barrel, positive: pincushion). */
  k1: number;
  /** Coefficient of r⁴. */
  k2: number;
}

export interface LensModel extends RadialCoefficients {
  /** Distortion centre, frame pixels (the image centre: width/2, height/2). */
  centre: PixelPoint;
  /** Length in pixels that counts as radius 1 (the half-diagonal). */
  normRadiusPx: number;
}

export const NO_DISTORTION: RadialCoefficients = { k1: 0, k2: 0 };

/**
 * The lens model for a frame of the given size. The centre is (width/2,
 * height/2) in the project's pixel convention (u right, v down, the top-left
 * corner of the frame at (0, 0)).
 */
export function lensModelForFrame(widthPx: number, heightPx: number, coefficients: RadialCoefficients): LensModel {
  if (!(widthPx > 0 && heightPx > 0)) throw new GeometryError('Frame width and height must be positive.', 'lens');
  return {
    k1: coefficients.k1,
    k2: coefficients.k2,
    centre: { u: widthPx / 2, v: heightPx / 2 },
    normRadiusPx: Math.hypot(widthPx, heightPx) / 2,
  };
}

/** r_d / r at undistorted normalised radius² r2. */
export function radialFactor(c: RadialCoefficients, r2: number): number {
  return 1 + r2 * (c.k1 + c.k2 * r2);
}

/** Distorted radius of an ideal radius r (normalised). */
export function distortRadius(c: RadialCoefficients, r: number): number {
  return r * radialFactor(c, r * r);
}

/** d r_d / d r. */
function distortRadiusSlope(c: RadialCoefficients, r: number): number {
  const r2 = r * r;
  return 1 + r2 * (3 * c.k1 + 5 * c.k2 * r2);
}

/** Ideal pixel → where the lens shows it. */
export function distort(model: LensModel, p: PixelPoint): PixelPoint {
  const x = (p.u - model.centre.u) / model.normRadiusPx;
  const y = (p.v - model.centre.v) / model.normRadiusPx;
  const f = radialFactor(model, x * x + y * y);
  return { u: model.centre.u + x * f * model.normRadiusPx, v: model.centre.v + y * f * model.normRadiusPx };
}

/**
 * Ideal radius r whose distorted radius is rd: Newton's method from r = rd,
 * on the monotonic branch that starts at the centre. Returns NaN when rd lies
 * beyond the fold of the polynomial (no ideal point is shown there).
 */
export function undistortRadius(c: RadialCoefficients, rd: number): number {
  if (rd === 0 || (c.k1 === 0 && c.k2 === 0)) return rd;
  let r = rd;
  for (let i = 0; i < 60; i++) {
    const slope = distortRadiusSlope(c, r);
    if (!(slope > 0)) return Number.NaN;
    const step = (distortRadius(c, r) - rd) / slope;
    r -= step;
    if (!(r > 0)) r = rd * 0.5;
    if (Math.abs(step) <= 1e-15 * Math.max(1, r)) break;
  }
  return r;
}

/** Clicked (distorted) pixel → its ideal position. */
export function undistort(model: LensModel, p: PixelPoint): PixelPoint {
  const x = (p.u - model.centre.u) / model.normRadiusPx;
  const y = (p.v - model.centre.v) / model.normRadiusPx;
  const rd = Math.hypot(x, y);
  if (rd === 0) return { u: p.u, v: p.v };
  const s = undistortRadius(model, rd) / rd;
  return { u: model.centre.u + x * s * model.normRadiusPx, v: model.centre.v + y * s * model.normRadiusPx };
}

/**
 * Coefficients a person can use on a frame: finite, and the distortion must
 * map radius 0…1 (the whole frame out to its corners) one-to-one, with the
 * corner displaced by no more than maxCornerShift of the half-diagonal (50 %
 * by default: stronger than that is a fisheye, which this model does not
 * describe). Returns a plain message, or null when the coefficients are usable.
 */
export function coefficientProblem(c: RadialCoefficients, maxCornerShift = 0.5): string | null {
  if (!Number.isFinite(c.k1) || !Number.isFinite(c.k2)) return 'The lens coefficients must be finite numbers.';
  // Walk the ideal radius outwards until its image reaches the frame corner (r_d = 1);
  // the slope must stay positive on the way, or two ideal points share one pixel.
  const step = 1e-3;
  let r = 0;
  while (distortRadius(c, r) < 1 && r <= 1 + maxCornerShift) {
    if (distortRadiusSlope(c, r + step) <= 0) {
      return 'These lens coefficients fold the image before its corners (the distortion is not one-to-one); check k1 and k2.';
    }
    r += step;
  }
  const cornerIdeal = undistortRadius(c, 1);
  if (!Number.isFinite(cornerIdeal) || Math.abs(cornerIdeal - 1) > maxCornerShift) {
    return `These lens coefficients move the frame corner by more than ${Math.round(maxCornerShift * 100)} % of the half-diagonal; ` +
      'that is a fisheye, not a lens this correction describes. Check k1 and k2.';
  }
  return null;
}
