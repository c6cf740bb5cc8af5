// The review pass after automatic marking: step only through the frames a
// person should look at — automatic marks below the team's review threshold,
// and any automatic mark the marker gave a reason to doubt.
import { isFlagged, type MarkSource } from '@shared/schemas/auto-mark';

export interface ReviewableMark {
  frameNumber: number;
  source?: MarkSource;
  confidence?: number | null;
  lowConfidenceReason?: string | null;
}

/** True when the mark waits for a person's look. */
export function needsReview(mark: ReviewableMark, threshold: number): boolean {
  if (mark.source !== 'auto') return false;
  return isFlagged({ source: 'auto', confidence: mark.confidence ?? null }, threshold) || !!mark.lowConfidenceReason;
}

/** Frames to review, in frame order. */
export function reviewFrames(marks: Iterable<ReviewableMark>, threshold: number): number[] {
  return [...marks].filter((m) => needsReview(m, threshold)).map((m) => m.frameNumber).sort((a, b) => a - b);
}

/** The next (or previous) frame to review from `current`, wrapping round; null when none is left. */
export function stepReview(frames: number[], current: number, direction: 1 | -1): number | null {
  if (frames.length === 0) return null;
  if (direction === 1) return frames.find((f) => f > current) ?? frames[0];
  for (let i = frames.length - 1; i >= 0; i--) if (frames[i] < current) return frames[i];
  return frames[frames.length - 1];
}

/** How sure the marker was, in words as well as a number (never colour alone). */
export function confidenceWords(mark: ReviewableMark, threshold: number): string | null {
  if (mark.source !== 'auto' || mark.confidence === null || mark.confidence === undefined) return null;
  const pct = `${Math.round(mark.confidence * 100)}%`;
  if (!needsReview(mark, threshold)) return `auto ${pct}`;
  return `auto ${pct}, check${mark.lowConfidenceReason ? `: ${mark.lowConfidenceReason}` : ''}`;
}
