// Each mark of the active track with its time and world position. A mark the
// server holds comes with the server's tS/xM/yM (computed from the saved
// calibration), used as is; only a mark not saved yet (an optimistic click or
// drag), or one on a clip whose calibration is still a draft, is placed here,
// with the one shared mapping (markTimeAndPlace).
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import type { CalibrationTransform } from '@shared/geometry/calibration-transform';
import { markTimeAndPlace } from '@shared/marking/mark-world';
import { marksQuery } from '@/api/marks/list-marks';
import type { Editor } from '../editor/editor-store';
import { marksOfTrack } from '../editor/editor-store';
import type { EditorMark } from '../editor/types';
import { useEditor } from './use-editor';

export interface WorldMark {
  frameNumber: number;
  tS: number | null;
  uPx: number;
  vPx: number;
  xM: number | null;
  yM: number | null;
  snapped: boolean;
}

export interface WorldMarks {
  trackId: string | null;
  marks: WorldMark[];
  /** Time of the frame after the last mark (where the preview predicts next); null at the clip's end. */
  nextTS: number | null;
}

export function useWorldMarks(editor: Editor, teamId: string, transform: CalibrationTransform | null): WorldMarks {
  const trackId = useEditor(editor, (s) => s.activeTrackId);
  const trackMarks = useEditor(editor, (s) => (trackId ? s.marksByTrack[trackId] : undefined));
  const frames = useEditor(editor, (s) => s.frames);
  // Already in the cache (the workspace loads every track's marks); kept current by each save's answer.
  const saved = useQuery({ ...marksQuery(teamId, trackId ?? ''), enabled: trackId !== null }).data;

  return useMemo(() => {
    const marks: EditorMark[] = marksOfTrack(editor.getState(), trackId);
    const frameIndex = new Map(frames.map((f, i) => [f.frameNumber, i]));
    const frameTime = (n: number) => {
      const i = frameIndex.get(n);
      return i === undefined ? null : frames[i].tS;
    };
    const savedByFrame = new Map((saved?.marks ?? []).map((m) => [m.frameNumber, m]));
    const rows = marks.map((m): WorldMark => {
      const s = savedByFrame.get(m.frameNumber);
      const stored = s && s.revision >= 0 && s.uPx === m.uPx && s.vPx === m.vPx ? s : null;
      const live = markTimeAndPlace(m, transform, frameTime);
      return {
        frameNumber: m.frameNumber,
        uPx: m.uPx,
        vPx: m.vPx,
        snapped: m.snapped,
        tS: stored?.tS ?? live.tS,
        xM: stored && stored.xM !== null ? stored.xM : live.xM,
        yM: stored && stored.yM !== null ? stored.yM : live.yM,
      };
    });
    const last = marks.length ? frameIndex.get(marks[marks.length - 1].frameNumber) : undefined;
    const after = last !== undefined ? frames[last + 1] : undefined;
    return { trackId, marks: rows, nextTS: after?.tS ?? null };
    // trackMarks is the dependency that changes when marks do.
  }, [editor, trackId, trackMarks, frames, transform, saved]); // eslint-disable-line react-hooks/exhaustive-deps
}
