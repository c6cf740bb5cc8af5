// Words beside the marks on the canvas: how sure the automatic marker was on
// the shown frame, and which marks of the trail sit off the live preview
// curve (their residual is out of line with the others).
import { useMemo } from 'react';
import type { CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { FitMark } from '@shared/physics/types';
import type { Editor } from '../editor/editor-store';
import type { FlightPreview } from '../editor/flight-preview';
import { previewResiduals } from '../editor/preview-residuals';
import { confidenceWords, needsReview } from '../editor/review-pass';
import type { MarkNote } from '../components/mark-notes-overlay';
import { useEditor } from './use-editor';
import type { WorldMarks } from './use-world-marks';

/** The marks drawn on a frame: the shown one and the five of the trail before it. */
const TRAIL = 5;

/** Frames of the active track whose mark is off the preview curve. */
export function useOffCurveFrames(placed: WorldMarks, preview: FlightPreview | null, transform: CalibrationTransform | null): Set<number> {
  return useMemo(() => {
    if (!preview || !transform) return new Set<number>();
    const used = placed.marks.filter((m) => m.tS !== null && m.xM !== null && m.yM !== null);
    const fitMarks: FitMark[] = used.map((m) => ({ tS: m.tS!, xM: m.xM!, yM: m.yM! }));
    const residuals = previewResiduals(fitMarks, preview, 1 / transform.pixelsPerMetre);
    return new Set(used.filter((_, i) => residuals[i]?.outOfLine).map((m) => m.frameNumber));
  }, [placed, preview, transform]);
}

export function useMarkNotes(editor: Editor, offCurve: Set<number>, threshold: number): MarkNote[] {
  const frameNumber = useEditor(editor, (s) => s.frameNumber);
  const marks = useEditor(editor, (s) => (s.activeTrackId ? s.marksByTrack[s.activeTrackId] : undefined));
  return useMemo(() => {
    if (!marks) return [];
    const notes: MarkNote[] = [];
    const here = marks[frameNumber];
    const words = here ? confidenceWords(here, threshold) : null;
    if (here && words) notes.push({ frameNumber, uPx: here.uPx, vPx: here.vPx, text: words, kind: needsReview(here, threshold) ? 'check' : 'auto' });
    const shown = Object.values(marks)
      .filter((m) => m.frameNumber <= frameNumber)
      .sort((a, b) => b.frameNumber - a.frameNumber)
      .slice(0, TRAIL + 1);
    for (const m of shown) if (offCurve.has(m.frameNumber)) notes.push({ frameNumber: m.frameNumber, uPx: m.uPx, vPx: m.vPx, text: 'off curve', kind: 'off-curve' });
    return notes;
  }, [marks, frameNumber, offCurve, threshold]);
}
