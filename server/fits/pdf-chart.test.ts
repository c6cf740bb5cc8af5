import { describe, expect, it } from 'vitest';
import { niceTicks } from './pdf-chart';

describe('chart ticks', () => {
  it('chart ticks are round 1-2-5 steps covering the data', () => {
    expect(niceTicks(0, 6.4)).toEqual([0, 2, 4, 6, 8]);
    expect(niceTicks(-0.013, 0.021)).toEqual([-0.02, -0.01, 0, 0.01, 0.02, 0.03]);
  });
});
