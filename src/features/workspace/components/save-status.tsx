import { Button } from '@/components/ui/button';
import type { MarkSaving } from '../hooks/use-mark-saving';

/** Whether every mark is stored, what failed, and who changed a frame under you. */
export function SaveStatus({ saving }: { saving: MarkSaving }) {
  return (
    <div className="flex flex-col gap-2">
      <p role="status" className="text-micro text-ink-faint" data-testid="save-status">
        {saving.pending > 0
          ? `Saving ${saving.pending} change${saving.pending === 1 ? '' : 's'}…`
          : saving.conflicts.length > 0
            ? `Saved, except ${saving.conflicts.length} frame${saving.conflicts.length === 1 ? '' : 's'} to settle below.`
            : 'All marks saved.'}
      </p>
      {saving.error && (
        <div role="alert" className="flex items-start justify-between gap-3 rounded-md border border-alert/40 bg-alert-light/60 px-3 py-2 text-body text-alert">
          <span>{saving.error}</span>
          <Button size="sm" variant="ghost" onClick={saving.dismissError}>Dismiss</Button>
        </div>
      )}
      {saving.conflicts.map((c) => (
        <div key={c.key} role="alert" className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-signal/50 bg-signal-light/50 px-3 py-2 text-body text-ink">
          <span>
            Frame {c.frameNumber}: changed by {c.byName}
            {c.theirs ? '' : ' (they removed the mark)'} while you were editing it.
          </span>
          <span className="flex gap-2">
            <Button size="sm" onClick={() => saving.keepTheirs(c)}>Keep theirs</Button>
            <Button size="sm" variant="primary" onClick={() => saving.takeMine(c)}>Use mine</Button>
          </span>
        </div>
      ))}
    </div>
  );
}
