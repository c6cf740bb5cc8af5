// Where in its exposure a frame is stamped.
//
// A camera exposes each frame for the shutter time and stamps it at the start,
// the middle or the end of that exposure (it varies by camera and recording
// mode). A moving projectile smears along its path while the shutter is open,
// and the centre of the smear — what a person or the centroid snap marks — is
// where it was at mid-exposure (for a body moving at a steady rate over the
// exposure; over a few milliseconds the change of speed is far below a pixel).
// So each mark's time moves to mid-exposure:
//     stamped at start:  +shutter/2,   middle: 0,   end: −shutter/2.

export const FRAME_STAMP_POSITIONS = ['start', 'middle', 'end'] as const;
export type FrameStampPosition = (typeof FRAME_STAMP_POSITIONS)[number];

/** Seconds to add to a frame's stamped time to get its mid-exposure time. */
export function midExposureShiftS(shutterS: number, stamp: FrameStampPosition): number {
  if (!(Number.isFinite(shutterS) && shutterS >= 0)) throw new RangeError('shutter time must be 0 or more seconds');
  switch (stamp) {
    case 'start': return shutterS / 2;
    case 'middle': return 0;
    case 'end': return -shutterS / 2;
  }
}

/**
 * A plain message when the shutter time cannot belong to a clip of this frame
 * rate (a frame cannot be exposed for longer than the time between frames), else null.
 */
export function shutterProblem(shutterS: number, frameRateHz: number): string | null {
  if (!(Number.isFinite(shutterS) && shutterS > 0)) return 'The shutter time must be a positive number of seconds.';
  if (!(Number.isFinite(frameRateHz) && frameRateHz > 0)) return 'The frame rate must be positive to check the shutter time.';
  const intervalS = 1 / frameRateHz;
  // A hair of slack for rounding in "1/240 s at 240 fps".
  if (shutterS > intervalS * (1 + 1e-9)) {
    return `A shutter time of ${(shutterS * 1000).toPrecision(3)} ms is longer than the ${(intervalS * 1000).toPrecision(3)} ms ` +
      'between frames at this frame rate; check the shutter time and the capture frame rate.';
  }
  return null;
}

/** Marks moved to mid-exposure. */
export function shiftToMidExposure<T extends { tS: number }>(marks: readonly T[], shutterS: number, stamp: FrameStampPosition): T[] {
  const shift = midExposureShiftS(shutterS, stamp);
  return marks.map((m) => ({ ...m, tS: m.tS + shift }));
}
