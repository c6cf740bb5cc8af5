import { useEffect, useRef, useState } from 'react';
import type { FitMark } from '@shared/physics/types';
import type { FlightPreview } from '../editor/flight-preview';
import { PREVIEW_MIN_MARKS } from '../editor/flight-preview';
import type { PreviewRequest } from '../editor/flight-preview-worker';

/** Fits the preview curves in a worker whenever the world marks change; the latest answer wins. */
export function useFlightPreview(marks: FitMark[] | null, nextTS: number | null): FlightPreview | null {
  const [preview, setPreview] = useState<FlightPreview | null>(null);
  const worker = useRef<Worker | null>(null);
  const lastId = useRef(0);

  useEffect(() => {
    const w = new Worker(new URL('../editor/flight-preview-worker.ts', import.meta.url), { type: 'module' });
    w.onmessage = (e: MessageEvent<{ id: number; preview: FlightPreview | null }>) => {
      if (e.data.id === lastId.current) setPreview(e.data.preview);
    };
    worker.current = w;
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  useEffect(() => {
    // nextTS is null once the clip's last frame is marked; the curves are still drawn, without a next-frame cross.
    if (!marks || marks.length < PREVIEW_MIN_MARKS) {
      lastId.current++;
      setPreview(null);
      return;
    }
    const id = ++lastId.current;
    const request: PreviewRequest = { id, marks, nextTS };
    worker.current?.postMessage(request);
  }, [marks, nextTS]);

  return preview;
}
