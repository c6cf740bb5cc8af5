/** A point on the frame, pixels: u to the right, v down. */
export interface PixelPoint {
  u: number;
  v: number;
}

/** A point in the flight plane, metres: x right/downrange, y up. */
export interface WorldPoint {
  x: number;
  y: number;
}

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
