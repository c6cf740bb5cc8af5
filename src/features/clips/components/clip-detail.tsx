import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { Link } from 'react-router';
import { CAN } from '@shared/roles';
import type { ClipView } from '@shared/schemas/clips';
import { ButtonLink } from '@/components/ui/button-link';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatBytes, formatDateTime } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { isWorking, useClip } from '@/api/clips/get-clip';
import { invalidateAfterExtraction } from '@/api/clips/clip-views';
import { useClipFrames } from '@/api/clips/list-clip-frames';
import { ExtractionStatus } from './extraction-status';
import { FrameViewer } from './frame-viewer';
import { TimeBasePanel } from './time-base-panel';

/** One clip: live extraction status, its time base, and its frames once they exist. */
export function ClipDetail({ teamId, clipId, initial, canEdit, onDeleted }: { teamId: string; clipId: string; initial?: ClipView; canEdit: boolean; onDeleted: () => void }) {
  const client = useQueryClient();
  const query = useClip(teamId, clipId);
  const clip = query.data ?? initial;
  const ready = clip?.status === 'ready';
  const frames = useClipFrames(teamId, clipId, ready);
  // Only the roles that may mark are invited to; everyone else may look at the marks.
  const canMark = useCurrentTeam().can(CAN.mark);

  // When extraction settles, the frame list and the shot's clip list are out of date.
  const lastStatus = useRef(clip?.status);
  useEffect(() => {
    if (!clip) return;
    if (lastStatus.current && lastStatus.current !== clip.status && !isWorking(clip.status)) {
      void invalidateAfterExtraction(client, teamId, clipId, clip.shotId);
    }
    lastStatus.current = clip.status;
  }, [clip, client, teamId, clipId]);

  if (!clip) return query.isLoading ? <LoadingBlock label="Loading the clip…" /> : <FormError error={query.error} />;

  return (
    <Card
      title={clip.originalName}
      subtitle={`${formatBytes(clip.sizeBytes)} · uploaded ${formatDateTime(clip.createdAt)}`}
      actions={
        ready && (
          <ButtonLink to={`/t/${teamId}/clips/${clip.id}/workspace`} variant={canMark ? 'primary' : 'secondary'} size="sm">
            {canMark ? 'Mark this clip' : 'View the marks'}
          </ButtonLink>
        )
      }
    >
      <div className="flex flex-col gap-5">
        <ExtractionStatus teamId={teamId} clip={clip} canEdit={canEdit} onDeleted={onDeleted} />
        {clip.duplicateOf && (
          <p role="note" className="rounded-md border border-signal/50 bg-signal-light/30 px-3 py-2 text-body">
            This file has the same contents as {clip.duplicateOf.originalName}, already uploaded{' '}
            <Link className="underline" to={`/t/${teamId}/shots/${clip.duplicateOf.shotId}`}>
              on another shot
            </Link>
            . If that was not intended, delete one of them.
          </p>
        )}
        <section aria-label="Time base">
          <h3 className="mb-2 text-body font-semibold">Time base</h3>
          <TimeBasePanel teamId={teamId} clip={clip} frames={frames.data} canEdit={canEdit} />
        </section>
        {ready && (
          <section aria-label="Frames">
            <h3 className="mb-2 text-body font-semibold">Frames</h3>
            {frames.data ? <FrameViewer teamId={teamId} clip={clip} frames={frames.data} /> : frames.error ? <FormError error={frames.error} /> : <LoadingBlock label="Loading frames…" />}
          </section>
        )}
      </div>
    </Card>
  );
}
