/// <reference lib="webworker" />
// Runs the preview fits off the main thread: a drag fit takes tens of
// milliseconds, which would otherwise stall clicking and stepping.
import { flightPreview } from './flight-preview';
import type { FitMark } from '@shared/physics/types';

export interface PreviewRequest {
  id: number;
  marks: FitMark[];
  /** null once the last mark sits on the clip's last frame. */
  nextTS: number | null;
}

self.onmessage = (event: MessageEvent<PreviewRequest>) => {
  const { id, marks, nextTS } = event.data;
  let preview: ReturnType<typeof flightPreview> | null;
  try {
    preview = flightPreview(marks, nextTS);
  } catch {
    // Too few marks, or a fit that does not converge yet: the overlay simply shows no preview.
    preview = null;
  }
  (self as unknown as Worker).postMessage({ id, preview });
};
