import { describe, expect, it } from 'vitest';
import { FIT_STATES } from '../../shared/schemas/fits';
import { HttpProblem } from '../http/problem';
import { reviewTransition } from './review-transition';

describe('reviewTransition', () => {
  it('decides a fit awaiting review', () => {
    expect(reviewTransition('awaiting-review', 'approve')).toBe('approved');
    expect(reviewTransition('awaiting-review', 'reject')).toBe('rejected');
  });

  it.each(FIT_STATES.filter((s) => s !== 'awaiting-review'))('refuses to review a %s fit with a 409 naming its state', (state) => {
    for (const decision of ['approve', 'reject'] as const) {
      let thrown: unknown;
      try {
        reviewTransition(state, decision);
      } catch (err) {
        thrown = err;
      }
      expect(thrown).toBeInstanceOf(HttpProblem);
      expect((thrown as HttpProblem).status).toBe(409);
      expect((thrown as HttpProblem).extra).toEqual({ state });
    }
  });
});
