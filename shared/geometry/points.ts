import { z } from 'zod';

// The two kinds of point every area shares. Defined here once, as zod schemas
// (they cross the wire in calibrations and marks) with their inferred types.

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);

/**
 * How far outside the frame a pixel coordinate may lie: the largest frame we
 * accept (8192 px a side) plus one such frame of margin on each side. Further
 * out is a typing error, and would only overflow the geometry downstream.
 */
export const PIXEL_COORD_MIN = -8192;
export const PIXEL_COORD_MAX = 16_384;

/** One pixel coordinate, bounded to the frame plus the margin above. */
export const pixelCoord = (what: string) =>
  finite(what).refine((v) => v >= PIXEL_COORD_MIN && v <= PIXEL_COORD_MAX, `${what} must be between ${PIXEL_COORD_MIN} and ${PIXEL_COORD_MAX} pixels`);

/** A point on the frame, pixels: u to the right, v down, origin at the top-left corner (sub-pixel values allowed). */
export const PixelPoint = z.object({ u: pixelCoord('u'), v: pixelCoord('v') });
export type PixelPoint = z.infer<typeof PixelPoint>;

/** A point in the flight plane, metres: x right/downrange, y up. */
export const WorldPoint = z.object({ x: finite('x'), y: finite('y') });
export type WorldPoint = z.infer<typeof WorldPoint>;

/** Thrown for calibration input that defines no usable transform; the message is meant for the person who entered it. */
export class GeometryError extends Error {
  constructor(
    message: string,
    /** Which input is at fault, as a body path (e.g. "plane.corners"). */
    readonly field: string,
  ) {
    super(message);
    this.name = 'GeometryError';
  }
}

export function distancePx(a: PixelPoint, b: PixelPoint): number {
  return Math.hypot(b.u - a.u, b.v - a.v);
}
