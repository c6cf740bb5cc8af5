import { z } from 'zod';

// The two kinds of point every area shares. Defined here once, as zod schemas
// (they cross the wire in calibrations and marks) with their inferred types.

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);

/** A point on the frame, pixels: u to the right, v down, origin at the top-left corner (sub-pixel values allowed). */
export const PixelPoint = z.object({ u: finite('u'), v: finite('v') });
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
