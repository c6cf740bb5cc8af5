// The review pass: steps only through the frames whose automatic mark needs a
// person's look (editor/review-pass.ts). Accept keeps the mark where it is and
// makes it the person's; a nudge is a drag of the mark or a fresh click with
// the snap; delete removes it. Each of these takes the frame off the list.
import { useCallback, useMemo, useState } from 'react';
import type { Editor } from '../editor/editor-store';
import { needsReview, reviewFrames, stepReview } from '../editor/review-pass';
import { useEditor } from './use-editor';

export type ReviewPass = ReturnType<typeof useReviewPass>;

export function useReviewPass(editor: Editor, threshold: number) {
  const trackId = useEditor(editor, (s) => s.activeTrackId);
  const marks = useEditor(editor, (s) => (s.activeTrackId ? s.marksByTrack[s.activeTrackId] : undefined));
  const frameNumber = useEditor(editor, (s) => s.frameNumber);
  const frames = useMemo(() => reviewFrames(Object.values(marks ?? {}), threshold), [marks, threshold]);
  const [active, setActive] = useState(false);
  const here = marks?.[frameNumber] ?? null;
  const hereNeedsReview = !!here && needsReview(here, threshold);

  const go = useCallback(
    (direction: 1 | -1, skip?: number) => {
      const list = skip === undefined ? frames : frames.filter((f) => f !== skip);
      const next = stepReview(list, editor.getState().frameNumber, direction);
      if (next === null) setActive(false);
      else editor.goToFrame(next);
    },
    [editor, frames],
  );

  const begin = useCallback(() => {
    if (frames.length === 0) return;
    setActive(true);
    const current = editor.getState().frameNumber;
    if (!frames.includes(current)) editor.goToFrame(stepReview(frames, current - 1, 1)!);
  }, [editor, frames]);

  const accept = useCallback(() => {
    if (!trackId || !here) return;
    editor.moveMark(trackId, here.frameNumber, { u: here.uPx, v: here.vPx });
    go(1, here.frameNumber);
  }, [editor, go, here, trackId]);

  const remove = useCallback(() => {
    if (!trackId || !here) return;
    editor.deleteMark(trackId, here.frameNumber);
    go(1, here.frameNumber);
  }, [editor, go, here, trackId]);

  return {
    frames,
    active,
    here,
    hereNeedsReview,
    /** 1-based place of the shown frame in the list, or null when it is not on it. */
    position: frames.includes(frameNumber) ? frames.indexOf(frameNumber) + 1 : null,
    begin,
    end: () => setActive(false),
    next: () => go(1),
    previous: () => go(-1),
    accept,
    remove,
  };
}
