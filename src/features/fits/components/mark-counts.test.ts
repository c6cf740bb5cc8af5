import { describe, expect, it } from 'vitest';
import { markCountsLine } from './mark-counts';

describe('markCountsLine', () => {
  it('says how many marks were automatic, by hand and left out', () => {
    expect(
      markCountsLine({
        automatic: 52,
        byHand: 3,
        leftOut: 2,
        reviewThreshold: 0.6,
        leftOutFrames: [
          { frameNumber: 14, confidence: 0.3, reason: 'weak contrast' },
          { frameNumber: 15, confidence: 0.5, reason: null },
        ],
      }),
    ).toBe('52 automatic, 3 by hand; 2 automatic marks below the 60 % review threshold left out (frames 14, 15)');
    expect(markCountsLine({ automatic: 0, byHand: 40, leftOut: 0, reviewThreshold: 0.6, leftOutFrames: [] })).toBe('0 automatic, 40 by hand; none left out (review threshold 60 %)');
    expect(markCountsLine(undefined)).toBeNull();
  });
});
