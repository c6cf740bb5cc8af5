import { AUTO_MARK_END_LABELS } from '@shared/schemas/auto-mark';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { ProgressBar } from '@/components/ui/progress-bar';
import { confidenceWords } from '../editor/review-pass';
import type { AutoMarking } from '../hooks/use-auto-mark';
import type { Editor } from '../editor/editor-store';
import { useAutoMarkKeys } from '../hooks/use-auto-mark-keys';
import { useReviewPass } from '../hooks/use-review-pass';
import { ReviewThresholdForm } from './review-threshold-form';

interface AutoMarkPanelProps {
  teamId: string;
  editor: Editor;
  auto: AutoMarking;
  threshold: number;
  /** May change the team's review threshold (those who run fits). */
  canSetThreshold: boolean;
}

/** Start automatic marking, watch it work, then step through the frames it was unsure about. */
export function AutoMarkPanel({ teamId, editor, auto, threshold, canSetThreshold }: AutoMarkPanelProps) {
  // The review pass follows the shown frame; kept here so stepping re-renders this panel, not the page.
  const review = useReviewPass(editor, threshold);
  useAutoMarkKeys(auto, review, editor);
  const run = auto.run;
  const toCheck = review.frames.length;
  return (
    <Card title="Auto-mark" subtitle={`Marks below ${Math.round(threshold * 100)} % confidence are flagged and left out of fits until checked`}>
      <div className="flex flex-col gap-3" data-testid="auto-mark-panel">
        <div className="flex flex-wrap items-center gap-2">
          <Button variant="primary" size="sm" onClick={auto.begin} disabled={!auto.canStart} busy={auto.starting} aria-keyshortcuts="T">
            Auto-mark track <kbd className="rounded border border-line px-1 text-[10px]">T</kbd>
          </Button>
          {auto.atWork && (
            <Button size="sm" variant="ghost" onClick={auto.stop} busy={auto.cancelling}>
              Cancel
            </Button>
          )}
        </div>
        <p className="text-micro text-ink-faint">Finds the projectile and follows it by itself; with a mark on the shown frame it starts from that mark. Marks you placed stay as they are.</p>
        {run && auto.atWork && (
          <ProgressBar
            value={run.state === 'queued' ? null : run.progress}
            label={run.state === 'queued' ? 'Auto-marking: waiting for a worker' : 'Auto-marking'}
            detail={run.state === 'queued' ? 'queued' : `${run.framesMarked} marks so far, ${Math.round(run.progress * 100)}%`}
          />
        )}
        {run && !auto.atWork && (
          <p role="status" data-testid="auto-mark-status" className="text-body">
            {run.state === 'done' && (
              <>
                <Badge tone="ok">Done</Badge> {run.framesMarked} marks, {run.framesFlagged} flagged
                {run.endReason ? `; stopped because ${AUTO_MARK_END_LABELS[run.endReason]}` : ''}
                {run.launchFrame !== null ? `; flight starts on frame ${run.launchFrame}` : ''}.
              </>
            )}
            {run.state === 'cancelled' && (
              <>
                <Badge tone="neutral">Cancelled</Badge> {run.error ?? `The marks written before the cancel (${run.framesMarked}) stay.`}
              </>
            )}
            {run.state === 'failed' && (
              <>
                <Badge tone="alert">Failed</Badge> {run.error}
              </>
            )}
          </p>
        )}
        <FormError error={auto.startError ?? auto.cancelError} />

        {!review.active ? (
          <div className="flex items-center justify-between gap-2">
            <span className="text-body text-ink-soft">{toCheck === 0 ? 'No automatic marks to check.' : `${toCheck} ${toCheck === 1 ? 'frame' : 'frames'} to check.`}</span>
            <Button size="sm" onClick={review.begin} disabled={toCheck === 0}>
              Review {toCheck > 0 ? toCheck : ''} to check
            </Button>
          </div>
        ) : (
          <div role="region" aria-label="Review pass" className="flex flex-col gap-2 rounded-card border border-line-strong bg-paper-sunk p-3">
            <p className="text-body" data-testid="review-position">
              {review.position !== null && review.here
                ? `Frame ${review.here.frameNumber}, ${review.position} of ${toCheck} to check: ${confidenceWords(review.here, threshold) ?? ''}`
                : toCheck === 0
                  ? 'Everything is checked.'
                  : 'This frame needs no check.'}
            </p>
            <p className="text-micro text-ink-faint">To nudge, drag the mark, or click the projectile with the snap on.</p>
            <div className="flex flex-wrap gap-2">
              <Button size="sm" variant="primary" onClick={review.accept} disabled={!review.hereNeedsReview}>
                Accept <kbd className="rounded border border-line px-1 text-[10px]">Enter</kbd>
              </Button>
              <Button size="sm" onClick={review.remove} disabled={!review.hereNeedsReview}>
                Delete mark
              </Button>
              <Button size="sm" onClick={review.previous} disabled={toCheck === 0} aria-keyshortcuts=",">
                Previous
              </Button>
              <Button size="sm" onClick={review.next} disabled={toCheck === 0} aria-keyshortcuts=".">
                Next
              </Button>
              <Button size="sm" variant="ghost" onClick={review.end}>
                End review
              </Button>
            </div>
          </div>
        )}
        {canSetThreshold && <ReviewThresholdForm key={threshold} teamId={teamId} threshold={threshold} />}
      </div>
    </Card>
  );
}
