// Saves every mark change as it happens. Writes to one frame of one track go
// out one after another (each needs the revision the previous one returned);
// different frames go in parallel. A stale write (409) becomes a conflict the
// person settles; any other failure rolls the editor back and says why.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Mark } from '@shared/schemas/marking';
import { ApiError } from '@/lib/api-client';
import { useDeleteMark } from '@/api/marks/delete-mark';
import { fetchMarks } from '@/api/marks/list-marks';
import { usePutMark } from '@/api/marks/put-mark';
import type { Editor, MarkWrite } from '../editor/editor-store';
import { markKey, type EditorMark, type MarkKey } from '../editor/types';

export interface MarkConflict {
  key: MarkKey;
  trackId: string;
  frameNumber: number;
  mine: EditorMark | null;
  theirs: Mark | null;
  byName: string;
}

export interface MarkSaving {
  pending: number;
  error: string | null;
  conflicts: MarkConflict[];
  dismissError: () => void;
  keepTheirs: (c: MarkConflict) => void;
  takeMine: (c: MarkConflict) => void;
  /** Record what the server holds (on load, after an import). */
  seed: (trackId: string, marks: Mark[]) => void;
}

export function apiMarkToEditor(trackId: string, m: Mark): EditorMark {
  return {
    trackId,
    frameNumber: m.frameNumber,
    uPx: m.uPx,
    vPx: m.vPx,
    placedUPx: m.placedUPx,
    placedVPx: m.placedVPx,
    snapped: m.snapped,
    source: m.source,
    confidence: m.confidence,
    lowConfidenceReason: m.lowConfidenceReason,
  };
}

export function useMarkSaving(teamId: string, editor: Editor): MarkSaving {
  const put = usePutMark(teamId);
  const del = useDeleteMark(teamId);
  /** Revision of the stored mark per track and frame, as last confirmed by the server. */
  const confirmed = useRef(new Map<MarkKey, number>());
  const queues = useRef(new Map<MarkKey, Promise<void>>());
  const [pending, setPending] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [conflicts, setConflicts] = useState<MarkConflict[]>([]);

  const seed = useCallback((trackId: string, marks: Mark[]) => {
    for (const key of [...confirmed.current.keys()]) if (key.startsWith(`${trackId}@`)) confirmed.current.delete(key);
    for (const m of marks) confirmed.current.set(markKey(trackId, m.frameNumber), m.revision);
  }, []);

  const onConflict = useCallback(
    async (write: MarkWrite) => {
      const key = markKey(write.trackId, write.frameNumber);
      let theirs: Mark | null = null;
      try {
        const now = await fetchMarks(teamId, write.trackId);
        theirs = now.marks.find((m) => m.frameNumber === write.frameNumber) ?? null;
      } catch {
        theirs = null;
      }
      const byName = theirs?.updatedBy?.displayName ?? 'someone else';
      setConflicts((cs) => [...cs.filter((c) => c.key !== key), { key, trackId: write.trackId, frameNumber: write.frameNumber, mine: write.mark, theirs, byName }]);
    },
    [teamId],
  );

  const send = useCallback(
    async (write: MarkWrite) => {
      const key = markKey(write.trackId, write.frameNumber);
      const expectedRevision = confirmed.current.get(key) ?? null;
      try {
        if (write.mark) {
          const m = write.mark;
          const result = await put.mutateAsync({
            trackId: write.trackId,
            frameNumber: write.frameNumber,
            body: { uPx: m.uPx, vPx: m.vPx, placedUPx: m.placedUPx, placedVPx: m.placedVPx, snapped: m.snapped, expectedRevision },
          });
          confirmed.current.set(key, result.mark.revision);
        } else {
          if (expectedRevision === null) return; // never stored, nothing to remove
          await del.mutateAsync({ trackId: write.trackId, frameNumber: write.frameNumber, expectedRevision });
          confirmed.current.delete(key);
        }
      } catch (err) {
        if (err instanceof ApiError && err.status === 404 && !write.mark) {
          confirmed.current.delete(key); // already gone: the wish is fulfilled
          return;
        }
        if (err instanceof ApiError && err.status === 409) {
          await onConflict(write);
          return;
        }
        editor.applyServerMark(write.trackId, write.frameNumber, write.previous);
        const what = write.mark ? 'was not saved' : 'was not removed';
        setError(`The mark on frame ${write.frameNumber} ${what}: ${err instanceof Error ? err.message : String(err)}. The frame shows what is stored.`);
      }
    },
    [put, del, editor, onConflict],
  );

  const enqueue = useCallback(
    (write: MarkWrite) => {
      const key = markKey(write.trackId, write.frameNumber);
      setPending((n) => n + 1);
      const next = (queues.current.get(key) ?? Promise.resolve())
        .then(() => send(write))
        .finally(() => setPending((n) => n - 1));
      queues.current.set(key, next);
      void next.then(() => {
        if (queues.current.get(key) === next) queues.current.delete(key);
      });
    },
    [send],
  );

  useEffect(() => {
    const off = editor.onMarkWrite(enqueue);
    return () => {
      off();
    };
  }, [editor, enqueue]);

  // Leaving with unsaved marks: let the browser ask first.
  useEffect(() => {
    if (pending === 0) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [pending]);

  const keepTheirs = useCallback(
    (c: MarkConflict) => {
      if (c.theirs) confirmed.current.set(c.key, c.theirs.revision);
      else confirmed.current.delete(c.key);
      editor.applyServerMark(c.trackId, c.frameNumber, c.theirs ? apiMarkToEditor(c.trackId, c.theirs) : null);
      setConflicts((cs) => cs.filter((x) => x.key !== c.key));
    },
    [editor],
  );

  const takeMine = useCallback(
    (c: MarkConflict) => {
      if (c.theirs) confirmed.current.set(c.key, c.theirs.revision);
      else confirmed.current.delete(c.key);
      setConflicts((cs) => cs.filter((x) => x.key !== c.key));
      enqueue({ trackId: c.trackId, frameNumber: c.frameNumber, mark: c.mine, previous: c.theirs ? apiMarkToEditor(c.trackId, c.theirs) : null });
    },
    [enqueue],
  );

  return { pending, error, conflicts, dismissError: () => setError(null), keepTheirs, takeMine, seed };
}
