import { useState } from 'react';
import type { ClipView } from '@shared/schemas/clips';
import { Button } from '@/components/ui/button';
import { ClipStatusBadge } from '@/components/ui/clip-status-badge';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { ProgressBar } from '@/components/ui/progress-bar';
import { isWorking } from '@/api/clips/get-clip';
import { useCancelClip } from '@/api/clips/cancel-clip';
import { useDeleteClip } from '@/api/clips/delete-clip';
import { useExtractClip } from '@/api/clips/extract-clip';

/** Where the extraction stands, live, with the controls that make sense in that state. */
export function ExtractionStatus({ teamId, clip, canEdit, onDeleted }: { teamId: string; clip: ClipView; canEdit: boolean; onDeleted: () => void }) {
  const cancel = useCancelClip(teamId);
  const extract = useExtractClip(teamId);
  const remove = useDeleteClip(teamId);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const working = isWorking(clip.status);
  const rangeFrames = clip.outFrame - clip.inFrame + 1;

  return (
    <div className="flex flex-col gap-3" aria-live="polite">
      <div className="flex flex-wrap items-center gap-2">
        <ClipStatusBadge status={clip.status} />
        <span className="text-micro text-ink-faint tabular-nums">
          {clip.status === 'ready'
            ? `${clip.extractedCount} frames extracted (frames ${clip.inFrame}–${clip.outFrame})`
            : `frames ${clip.inFrame}–${clip.outFrame} of the file`}
        </span>
      </div>
      {working && (
        <ProgressBar
          label={clip.status === 'queued' ? 'Queued' : 'Extracting frames'}
          value={clip.status === 'queued' ? null : clip.progress}
          detail={clip.status === 'queued' ? 'waiting for the worker…' : `${Math.round(clip.progress * 100)}% · about ${Math.round(clip.progress * rangeFrames)} of ${rangeFrames} frames`}
        />
      )}
      {clip.waitingFor === 'storage' && (
        <p className="text-body text-ink-soft">Waiting for the file store to answer again; the extraction retries by itself.</p>
      )}
      {clip.status === 'failed' && clip.error && (
        <p role="alert" className="rounded-md border border-alert/40 bg-alert-light/60 px-3 py-2 text-body text-alert">
          {clip.error}
        </p>
      )}
      <FormError error={cancel.error ?? extract.error} />
      {canEdit && (
        <div className="flex flex-wrap gap-2">
          {working ? (
            <Button size="sm" onClick={() => cancel.mutate(clip.id)} busy={cancel.isPending}>
              Cancel extraction
            </Button>
          ) : (
            <Button size="sm" onClick={() => extract.mutate(clip.id)} busy={extract.isPending}>
              {clip.status === 'ready' ? 'Extract again' : 'Retry extraction'}
            </Button>
          )}
          <Button size="sm" variant="ghost" onClick={() => setConfirmDelete(true)}>
            Delete clip
          </Button>
        </div>
      )}
      <ConfirmDialog
        open={confirmDelete}
        title={`Delete ${clip.originalName}?`}
        description="The clip file and every extracted frame are removed. Marks made on this clip go with it."
        confirmLabel="Delete clip"
        busy={remove.isPending}
        onClose={() => {
          setConfirmDelete(false);
          remove.reset();
        }}
        onConfirm={() =>
          remove.mutate(clip.id, {
            onSuccess: () => {
              setConfirmDelete(false);
              onDeleted();
            },
          })
        }
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </div>
  );
}
