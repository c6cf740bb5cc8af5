import { describe, expect, it } from 'vitest';
import { confidenceWords, needsReview, reviewFrames, stepReview } from './review-pass';

const auto = (frameNumber: number, confidence: number, lowConfidenceReason: string | null = null) => ({ frameNumber, source: 'auto' as const, confidence, lowConfidenceReason });

describe('review pass', () => {
  it('picks automatic marks below the threshold or with a stated doubt, never a person’s', () => {
    const marks = [
      auto(7, 0.95),
      auto(3, 0.4, 'weak contrast'),
      auto(5, 0.59),
      auto(6, 0.6),
      auto(9, 0.9, 'another object near'),
      { frameNumber: 4, source: 'hand' as const, confidence: null },
      { frameNumber: 8, source: 'snap' as const, confidence: null },
    ];
    // 0.6 itself is not below 0.6.
    expect(reviewFrames(marks, 0.6)).toEqual([3, 5, 9]);
    expect(needsReview(auto(1, 0.2), 0.1)).toBe(false);
    expect(needsReview({ frameNumber: 1 }, 0.6)).toBe(false);
  });

  it('steps forward and back through the frames to review, wrapping round', () => {
    const frames = [3, 5, 9];
    expect(stepReview(frames, 0, 1)).toBe(3);
    expect(stepReview(frames, 3, 1)).toBe(5);
    expect(stepReview(frames, 9, 1)).toBe(3);
    expect(stepReview(frames, 5, -1)).toBe(3);
    expect(stepReview(frames, 3, -1)).toBe(9);
    expect(stepReview([], 3, 1)).toBeNull();
  });

  it('says how sure the marker was in words', () => {
    expect(confidenceWords(auto(1, 0.914), 0.6)).toBe('auto 91%');
    expect(confidenceWords(auto(1, 0.42, 'weak contrast'), 0.6)).toBe('auto 42%, check: weak contrast');
    expect(confidenceWords(auto(1, 0.42), 0.6)).toBe('auto 42%, check');
    expect(confidenceWords({ frameNumber: 1, source: 'hand', confidence: null }, 0.6)).toBeNull();
  });
});
