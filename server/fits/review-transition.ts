import type { FitState } from '../../shared/schemas/fits';
import { conflict } from '../http/problem';

export type ReviewDecision = 'approve' | 'reject';

/**
 * The review state machine: only a fit awaiting review can be decided; approved
 * fits are frozen, rejected ones stay rejected, stale ones must be run again.
 * Returns the state the decision leads to, or throws the 409 that explains why not.
 */
export function reviewTransition(state: FitState, decision: ReviewDecision): 'approved' | 'rejected' {
  switch (state) {
    case 'approved':
      throw conflict('This fit is approved and frozen; it cannot be reviewed again. Run a new fit to revise it.', { state });
    case 'rejected':
      throw conflict('This fit was already rejected. Run a new fit after fixing its inputs.', { state });
    case 'stale':
      throw conflict('The marks or the calibration changed after this fit ran. Run the fit again and review the new one.', { state });
    case 'awaiting-review':
      return decision === 'approve' ? 'approved' : 'rejected';
  }
}
