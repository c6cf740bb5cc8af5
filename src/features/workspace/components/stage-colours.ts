// Colours on the frame (DEVELOPERS.md, "Look and feel"): amber for what a
// person placed, teal for what the model says, violet dashed for drag-free.
export const STAGE = {
  signal: '#d9822b',
  fit: '#1f7a72',
  vacuum: '#7a6fa8',
  ink: '#1b2433',
  paper: '#fffdf8',
  alert: '#b3261e',
} as const;

/** Radius of a mark's ring on screen, px. */
export const MARK_RADIUS_PX = 6;
