// A small hook for `npm run bench` (scripts/bench-workspace.ts): when the
// bench page sets window.__arcbenchFrameTimings, the keyboard handler (a step
// key) or the stage (a marking click) notes
// the input time and the frame layer notes when it drew that frame, then
// the next animation frame (the paint). Nothing is recorded otherwise.

export interface FrameTimingSample {
  frameNumber: number;
  keyAt: number;
  drawnAt: number;
  paintedAt: number;
}

interface FrameTimings {
  pendingKeyAt: number | null;
  samples: FrameTimingSample[];
}

declare global {
  interface Window {
    __arcbenchFrameTimings?: FrameTimings;
  }
}

export function recordStepKey(timeStamp: number): void {
  const t = window.__arcbenchFrameTimings;
  if (t) t.pendingKeyAt = timeStamp;
}

export function recordFrameDrawn(drawnFrame: number, wantedFrame: number): void {
  const t = window.__arcbenchFrameTimings;
  if (!t || t.pendingKeyAt === null || drawnFrame !== wantedFrame) return;
  const keyAt = t.pendingKeyAt;
  t.pendingKeyAt = null;
  const drawnAt = performance.now();
  requestAnimationFrame(() => t.samples.push({ frameNumber: drawnFrame, keyAt, drawnAt, paintedAt: performance.now() }));
}
