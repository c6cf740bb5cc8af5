import { useState } from 'react';
import type { FitDetail } from '@shared/schemas/fits';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { TextareaField } from '@/components/ui/textarea-field';
import { OWN_FIT_APPROVAL_REASON } from '@shared/schemas/team-settings';
import { useReviewFit } from '@/api/fits/review-fit';
import { useMe } from '@/api/me/get-me';
import { useTeamSettings } from '@/api/team-settings/get-team-settings';
import { apiFieldError } from '@/lib/form-errors';
import { formatDateTime } from '@/lib/format';
import { FitStateBadge } from './fit-state-badge';

/** Sign-off for engineers: approve or reject a fit awaiting review. Approved fits are frozen. */
export function ReviewPanel({ teamId, fit, canReview }: { teamId: string; fit: FitDetail; canReview: boolean }) {
  const [note, setNote] = useState('');
  const review = useReviewFit(teamId, fit.id);
  const open = fit.state === 'awaiting-review';
  const submit = (decision: 'approve' | 'reject') => review.mutate({ decision, note });
  const me = useMe();
  const settings = useTeamSettings(teamId);
  // Separation of duties: the server refuses too (403); the page says why before anyone tries.
  const ownFit = !!me.data && fit.createdBy?.id === me.data.id;
  const approvalBlocked = ownFit && settings.data?.separateFitApproval !== false;

  return (
    <Card title="Review" actions={<FitStateBadge state={fit.state} inputsChanged={fit.staleness.inputsChanged} />}>
      {fit.reviewedBy && (
        <p className="mb-2 text-body">
          {fit.state === 'approved' ? 'Approved' : 'Rejected'} by <span className="font-medium">{fit.reviewedBy.displayName}</span>
          {fit.reviewedAt && <> on {formatDateTime(fit.reviewedAt)}</>}
          {fit.reviewNote && <>: <q>{fit.reviewNote}</q></>}
        </p>
      )}
      {fit.state === 'approved' && <p className="text-micro text-ink-faint">An approved fit is frozen: its numbers and inputs no longer change. Run a new fit to revise it.</p>}
      {fit.state === 'stale' && <p className="text-body text-ink-soft">The marks or the calibration changed after this fit ran, so it can no longer be reviewed. Run the fit again from the shot’s fit list.</p>}
      {open && !canReview && <p className="text-body text-ink-soft">Waiting for an engineer to review it.</p>}
      {open && canReview && (
        <form
          className="space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            submit('approve');
          }}
        >
          <TextareaField label="Note" hint="Required when rejecting: say what to fix." value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} error={apiFieldError(review.error, 'note')} />
          <FormError error={review.error} hideFields={['note']} />
          <div className="flex gap-2">
            <Button
              type="submit"
              variant="primary"
              busy={review.isPending && review.variables?.decision === 'approve'}
              disabled={review.isPending || approvalBlocked}
              aria-describedby={approvalBlocked ? 'own-fit-approval' : undefined}
            >
              Approve fit
            </Button>
            <Button variant="danger" busy={review.isPending && review.variables?.decision === 'reject'} disabled={review.isPending} onClick={() => submit('reject')}>
              Reject fit
            </Button>
          </div>
          {approvalBlocked && (
            <p id="own-fit-approval" className="text-micro text-ink-soft">
              {OWN_FIT_APPROVAL_REASON}
            </p>
          )}
        </form>
      )}
    </Card>
  );
}
