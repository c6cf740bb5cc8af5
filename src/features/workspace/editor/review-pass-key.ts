// Which review-pass action a key stands for. The straight-edge tool ends its
// edge on Enter and the review pass accepts the shown mark on Enter; both
// listen on the window, so without a rule one press did both. The tool in use
// owns Enter while it is the straight-edge tool; everywhere else Enter accepts.
import type { ToolId } from './types';

export type ReviewKeyAction = 'accept' | 'next' | 'previous';

export interface ReviewKeyContext {
  /** The editor's active tool when the key went down. */
  activeTool: ToolId;
  /** The shown frame holds an automatic mark that waits for a person's look. */
  hereNeedsReview: boolean;
  /** The key went down on a focused button or link, which Enter presses instead. */
  onControl: boolean;
}

/** Tools that take Enter themselves; the review pass leaves it to them. */
const TOOLS_OWNING_ENTER: ReadonlySet<ToolId> = new Set(['straight-edge']);

/** The review-pass action of a bare key while the pass is on, or null when the key is not the pass's. */
export function reviewKeyAction(key: string, ctx: ReviewKeyContext): ReviewKeyAction | null {
  if (key === 'Enter') return ctx.hereNeedsReview && !ctx.onControl && !TOOLS_OWNING_ENTER.has(ctx.activeTool) ? 'accept' : null;
  if (key === '.') return 'next';
  if (key === ',') return 'previous';
  return null;
}
