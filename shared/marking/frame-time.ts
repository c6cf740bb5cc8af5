// The one rule for when a frame was captured. The clip's frame table (from
// extraction) knows about dropped and duplicated frames, so its time wins;
// without it, a constant capture rate is assumed. Server views, the fit input
// and the client's scrubber all ask here, so they never disagree about a mark's t.

/**
 * Capture time of `frameNumber`, seconds: the frame table's time when there is
 * one, else frameNumber / captureFps; null when neither is known.
 */
export function frameTimeS(frameNumber: number, tableTimeS: number | null | undefined, captureFps: number | null | undefined): number | null {
  if (tableTimeS !== null && tableTimeS !== undefined) return tableTimeS;
  return captureFps !== null && captureFps !== undefined && captureFps > 0 ? frameNumber / captureFps : null;
}
