// Automatic marking from the workspace: start a run on the active track (from
// the person's mark on the shown frame as a seed, when there is one), follow
// it, and bring its marks into the editor as they are written, so they appear
// live. A run already at work when the page opens is picked up again.
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { AutoMarkBody } from '@shared/schemas/auto-mark';
import { useCancelAutoMarkRun } from '@/api/auto-mark/cancel-auto-mark-run';
import { isRunAtWork, useAutoMarkRun } from '@/api/auto-mark/get-auto-mark-run';
import { useTrackAutoMarkRuns } from '@/api/auto-mark/list-track-auto-mark-runs';
import { useStartAutoMark } from '@/api/auto-mark/start-auto-mark';
import { fetchMarks } from '@/api/marks/list-marks';
import { markKeys } from '@/api/query-keys';
import type { Editor } from '../editor/editor-store';
import { useEditor } from './use-editor';
import { apiMarkToEditor, type MarkSaving } from './use-mark-saving';

export type AutoMarking = ReturnType<typeof useAutoMark>;

export function useAutoMark(teamId: string, editor: Editor, saving: MarkSaving) {
  const trackId = useEditor(editor, (s) => s.activeTrackId);
  const canMark = useEditor(editor, (s) => s.permissions.canMark);
  const client = useQueryClient();
  const runs = useTrackAutoMarkRuns(teamId, trackId);
  const [picked, setPicked] = useState<{ trackId: string; runId: string } | null>(null);
  const runId = picked && picked.trackId === trackId ? picked.runId : null;

  // The newest run of the track, if one is still at work (say, started before a reload).
  useEffect(() => {
    const latest = runs.data?.runs[0];
    if (trackId && latest && !runId && isRunAtWork(latest.state)) setPicked({ trackId, runId: latest.id });
  }, [runs.data, trackId, runId]);

  const run = useAutoMarkRun(teamId, runId);
  const start = useStartAutoMark(teamId);
  const cancel = useCancelAutoMarkRun(teamId);

  // Live marks: each poll of a run at work (and once more when it ends) brings the track's stored marks in.
  const lastSync = useRef<string>('');
  const pendingWrites = saving.pending;
  const seed = saving.seed;
  useEffect(() => {
    const r = run.data;
    if (!r) return;
    const key = `${r.id}:${r.state}:${r.framesMarked}:${r.progress}`;
    // A person's unsaved edits come first; the next poll catches up.
    if (key === lastSync.current || pendingWrites > 0) return;
    lastSync.current = key;
    let stale = false;
    void fetchMarks(teamId, r.trackId).then((now) => {
      if (stale) return;
      seed(r.trackId, now.marks);
      client.setQueryData(markKeys.ofTrack(teamId, r.trackId), now);
      editor.replaceTrackMarks(r.trackId, now.marks.map((m) => apiMarkToEditor(r.trackId, m)));
    });
    return () => {
      stale = true;
    };
  }, [run.data, pendingWrites, seed, editor, teamId, client]);

  const atWork = !!run.data && isRunAtWork(run.data.state);

  const begin = useCallback(() => {
    const s = editor.getState();
    if (!s.activeTrackId || !s.permissions.canMark || start.isPending) return;
    const here = s.marksByTrack[s.activeTrackId]?.[s.frameNumber];
    // A person's mark on the shown frame says where the projectile is: start there.
    const body: AutoMarkBody = here && here.source !== 'auto' ? { seed: { frameNumber: here.frameNumber, uPx: here.uPx, vPx: here.vPx } } : {};
    const forTrack = s.activeTrackId;
    start.mutate({ trackId: forTrack, body }, { onSuccess: (started) => setPicked({ trackId: forTrack, runId: started.runId }) });
  }, [editor, start]);

  const stop = useCallback(() => {
    if (runId) cancel.mutate(runId);
  }, [cancel, runId]);

  return {
    trackId,
    canStart: canMark && !!trackId && !atWork && !start.isPending,
    run: run.data ?? null,
    atWork,
    starting: start.isPending,
    startError: start.error,
    cancelError: cancel.error,
    cancelling: cancel.isPending,
    begin,
    stop,
  };
}
