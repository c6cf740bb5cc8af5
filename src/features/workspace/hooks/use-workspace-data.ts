// Loads everything the workspace needs and hands it to the editor once.
// After that the editor holds the live copy; the queries only refresh
// things the editor does not own (clip status, saved calibration versions).
import { useEffect, useRef } from 'react';
import { CAN } from '@shared/roles';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useClip } from '@/api/clips/get-clip';
import { useClipFrames } from '@/api/clips/list-clip-frames';
import { useCurrentCalibration } from '@/api/calibrations/get-current-calibration';
import { useMarksOfTracks } from '@/api/marks/list-marks';
import { useTracks } from '@/api/tracks/list-tracks';
import { useCreateTrack } from '@/api/tracks/create-track';
import { calibrationToDraft } from '../editor/calibration-geometry';
import type { Editor } from '../editor/editor-store';
import type { EditorTrack } from '../editor/types';
import { apiMarkToEditor, type MarkSaving } from './use-mark-saving';

export function useWorkspaceData(teamId: string, clipId: string, editor: Editor, saving: MarkSaving) {
  // The team gate above this page has checked membership, so the role is known.
  const { role, can } = useCurrentTeam();
  const clip = useClip(teamId, clipId);
  const frames = useClipFrames(teamId, clipId, clip.data?.status === 'ready');
  const calibration = useCurrentCalibration(teamId, clipId);
  const tracks = useTracks(teamId, clipId);
  const trackList = tracks.data?.tracks ?? [];
  const marks = useMarksOfTracks(teamId, trackList.map((t) => t.id));
  const createTrack = useCreateTrack(teamId, clipId);

  const canMark = can(CAN.mark);
  const canCalibrate = can(CAN.calibrate);

  // A clip nobody has marked yet gets its projectile track as soon as someone who may mark opens it.
  const autoCreated = useRef(false);
  useEffect(() => {
    if (tracks.data && tracks.data.tracks.length === 0 && canMark && !autoCreated.current) {
      autoCreated.current = true;
      createTrack.mutate({ name: 'Projectile', kind: 'projectile' });
    }
  }, [tracks.data, canMark, createTrack]);

  const loaded = useRef(false);
  const allMarksLoaded = marks.every((q) => q.data);
  // Someone who may mark waits for the projectile track being created; a reader opens the clip as it is.
  const ready = !!(clip.data && frames.data && calibration.data && tracks.data && allMarksLoaded && (trackList.length > 0 || !canMark));

  useEffect(() => {
    if (!ready || loaded.current) return;
    loaded.current = true;
    const editorTracks: EditorTrack[] = trackList.map((t) => ({ id: t.id, kind: t.kind, label: t.name }));
    const all = trackList.flatMap((t, i) => {
      const m = marks[i].data!.marks;
      saving.seed(t.id, m);
      return m.map((x) => apiMarkToEditor(t.id, x));
    });
    editor.load({
      frames: frames.data!.map((f) => ({ frameNumber: f.frameNumber, tS: f.tS })),
      tracks: editorTracks,
      marks: all,
      calibration: calibration.data!.calibration ? calibrationToDraft(calibration.data!.calibration) : null,
      permissions: { canMark, canCalibrate },
    });
  });

  // Tracks added later (another track, a muzzle point) join the editor without a reload.
  useEffect(() => {
    if (!loaded.current || !tracks.data) return;
    const known = editor.getState().tracks.map((t) => t.id).join();
    const now = tracks.data.tracks.map((t) => t.id).join();
    if (known !== now) editor.setTracks(tracks.data.tracks.map((t) => ({ id: t.id, kind: t.kind, label: t.name })));
  }, [tracks.data, editor]);

  const error = clip.error ?? frames.error ?? calibration.error ?? tracks.error ?? marks.find((q) => q.error)?.error ?? null;
  return {
    role,
    clip: clip.data,
    savedCalibration: calibration.data?.calibration ?? null,
    tracks: trackList,
    ready,
    error,
    createTrack,
  };
}
