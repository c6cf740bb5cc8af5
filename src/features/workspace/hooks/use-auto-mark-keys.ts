// Keys of automatic marking and its review pass. T starts auto-marking the
// active track; in the review pass Enter accepts the shown mark, and . and ,
// step to the next and previous frame to check (Delete removes a mark as
// everywhere in the workspace). While the straight-edge tool is active, Enter
// ends its edge instead (editor/review-pass-key.ts).
import { useEffect } from 'react';
import type { Editor } from '../editor/editor-store';
import { reviewKeyAction } from '../editor/review-pass-key';
import type { AutoMarking } from './use-auto-mark';
import type { ReviewPass } from './use-review-pass';

export const AUTO_MARK_SHORTCUTS: { keys: string; what: string }[] = [
  { keys: 'T', what: 'Auto-mark the active track (from the mark on this frame, if there is one)' },
  { keys: 'Enter', what: 'Review pass: accept the shown mark and go to the next to check (with the straight edge, Enter ends the edge instead)' },
  { keys: '. / ,', what: 'Review pass: next / previous frame to check' },
];

function typingIn(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName) || !!el.closest('dialog'));
}

export function useAutoMarkKeys(auto: AutoMarking, review: ReviewPass, editor: Editor) {
  useEffect(() => {
    const down = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.ctrlKey || e.metaKey || e.altKey || typingIn(e.target)) return;
      if ((e.key === 't' || e.key === 'T') && auto.canStart) {
        e.preventDefault();
        auto.begin();
        return;
      }
      if (!review.active) return;
      const action = reviewKeyAction(e.key, {
        activeTool: editor.getState().activeTool,
        hereNeedsReview: review.hereNeedsReview,
        // Enter on a focused button presses that button; only a bare Enter accepts.
        onControl: !!(e.target as HTMLElement | null)?.closest('button, a'),
      });
      if (!action) return;
      e.preventDefault();
      if (action === 'accept') review.accept();
      else if (action === 'next') review.next();
      else review.previous();
    };
    window.addEventListener('keydown', down);
    return () => window.removeEventListener('keydown', down);
  }, [auto, review, editor]);
}
