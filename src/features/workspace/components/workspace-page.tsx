import { useCallback, useMemo, useState } from 'react';
import { useParams } from 'react-router';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadingBlock } from '@/components/ui/spinner';
import { ProgressBar } from '@/components/ui/progress-bar';
import type { FitMark } from '@shared/physics/types';
import { transformOfDraft } from '../editor/calibration-geometry';
import { zoomAtCursor } from '../editor/tools/view-behaviour';
import type { TrackKind } from '../editor/types';
import { useEditor } from '../hooks/use-editor';
import { useFlightPreview } from '../hooks/use-flight-preview';
import { useMarkSaving } from '../hooks/use-mark-saving';
import { useWorkspaceData } from '../hooks/use-workspace-data';
import { useWorkspaceEditor } from '../hooks/use-workspace-editor';
import { useWorkspaceKeys } from '../hooks/use-workspace-keys';
import { useWorldMarks } from '../hooks/use-world-marks';
import { CAN } from '@shared/roles';
import { useReviewThreshold } from '@/api/auto-mark/get-auto-mark-settings';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useAutoMark } from '../hooks/use-auto-mark';
import { useOffCurveFrames } from '../hooks/use-mark-notes';
import { AutoMarkPanel } from './auto-mark-panel';
import { CalibrationCard } from './calibration-card';
import { FrameScrubber } from './frame-scrubber';
import { FrameStage } from './frame-stage';
import { MarksLedger } from './marks-ledger';
import { PreviewLegend } from './preview-legend';
import { SaveStatus } from './save-status';
import { SkipConfirmNote } from './skip-confirm-note';
import { ShortcutHelpDialog } from './shortcut-help-dialog';
import { ToolDialogs } from './tool-dialogs';
import { ToolPalette } from './tool-palette';
import { TracksPanel } from './tracks-panel';

/** /t/:teamId/clips/:clipId/workspace — calibrate the clip and mark the projectile frame by frame. */
export function WorkspacePage() {
  const { teamId = '', clipId = '' } = useParams();
  // A new editor per clip: key the inner page by clip so nothing leaks between clips.
  return <Workspace key={`${teamId}/${clipId}`} teamId={teamId} clipId={clipId} />;
}

function Workspace({ teamId, clipId }: { teamId: string; clipId: string }) {
  const { editor, frameCache } = useWorkspaceEditor(teamId, clipId);
  const saving = useMarkSaving(teamId, editor);
  const data = useWorkspaceData(teamId, clipId, editor, saving);
  const [helpOpen, setHelpOpen] = useState(false);
  const [fitRequest, setFitRequest] = useState(0);

  const onZoom = useCallback(
    (factor: number) => {
      const { view } = editor.getState();
      const el = document.querySelector('[data-testid="frame-stage"]');
      const r = el?.getBoundingClientRect();
      editor.setView(zoomAtCursor(view, { x: (r?.width ?? 0) / 2, y: (r?.height ?? 0) / 2 }, factor));
    },
    [editor],
  );
  const { spaceHeld } = useWorkspaceKeys(editor, { onHelp: () => setHelpOpen(true), onFit: () => setFitRequest((n) => n + 1), onZoom });

  const draft = useEditor(editor, (s) => s.calibrationDraft);
  const transformResult = useMemo(() => transformOfDraft(draft), [draft]);
  const transform = transformResult?.ok ? transformResult.transform : null;

  const placed = useWorldMarks(editor, teamId, transform);
  const markCount = placed.marks.length;
  const worldMarks = useMemo(() => {
    if (!transform || markCount === 0) return null;
    const world: FitMark[] = [];
    for (const m of placed.marks) if (m.tS !== null && m.xM !== null && m.yM !== null) world.push({ tS: m.tS, xM: m.xM, yM: m.yM });
    return world;
  }, [placed, transform, markCount]);
  const nextTS = worldMarks ? placed.nextTS : null;
  const preview = useFlightPreview(worldMarks, nextTS);

  // Automatic marking and the marks off the preview curve. The review pass and the
  // words beside the marks follow the shown frame, so they live in the panel and
  // the stage: stepping a frame must not re-render this whole page.
  const { can } = useCurrentTeam();
  const threshold = useReviewThreshold(teamId);
  const auto = useAutoMark(teamId, editor, saving);
  const offCurve = useOffCurveFrames(placed, preview, transform);
  const markNotes = useMemo(() => ({ offCurve, threshold }), [offCurve, threshold]);

  const addTrack = (kind: TrackKind) => {
    const count = data.tracks.filter((t) => t.kind === kind).length;
    const name = kind === 'muzzle' ? (count ? `Muzzle ${count + 1}` : 'Muzzle') : `Projectile ${count + 1}`;
    return data.createTrack.mutateAsync({ name, kind });
  };

  if (data.error) {
    return (
      <div className="p-6">
        <EmptyState title="The workspace could not open this clip">{data.error.message}</EmptyState>
      </div>
    );
  }
  const clip = data.clip;
  if (clip && clip.status !== 'ready') {
    return (
      <div className="p-6">
        <EmptyState title={clip.status === 'failed' ? 'Frames could not be extracted' : 'Frames are still being extracted'}>
          {clip.status === 'failed' ? clip.error : <ProgressBar value={clip.progress} label={`Extracting frames of ${clip.originalName}`} />}
        </EmptyState>
      </div>
    );
  }
  if (!data.ready || !clip) return <LoadingBlock label="Opening the workspace…" />;

  return (
    <section className="flex flex-col gap-3" aria-label="Workspace">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div className="min-w-0">
          <p className="text-micro font-medium uppercase tracking-wider text-ink-faint">Calibrate and mark</p>
          <h1 className="truncate text-title text-ink">{clip.originalName}</h1>
          <p className="text-micro text-ink-faint">
            {clip.frameWidth} × {clip.frameHeight} px · {clip.frameCount} frames · captured at {clip.captureFps} fps · you are {data.role}
          </p>
        </div>
        <Button size="sm" variant="ghost" onClick={() => setHelpOpen(true)} aria-keyshortcuts="?">
          Keys <kbd className="rounded border border-line px-1 text-[10px]">?</kbd>
        </Button>
      </header>
      <ToolPalette editor={editor} />
      <div className="grid gap-3 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-2">
          {/* As tall as the frame's shape asks for, up to most of the window. */}
          <div className="max-h-[72vh] w-full" style={{ aspectRatio: `${clip.frameWidth} / ${clip.frameHeight}` }}>
            <FrameStage
              editor={editor}
              frameCache={frameCache}
              imageSize={{ width: clip.frameWidth, height: clip.frameHeight }}
              transform={transform}
              preview={preview}
              spaceHeld={spaceHeld}
              fitRequest={fitRequest}
              markNotes={markNotes}
            />
          </div>
          <FrameScrubber editor={editor} captureFps={clip.captureFps} />
          <SkipConfirmNote editor={editor} />
          <SaveStatus saving={saving} />
        </div>
        <aside className="flex flex-col gap-3" aria-label="Panels">
          <TracksPanel editor={editor} onAdd={addTrack} adding={data.createTrack.isPending} teamId={teamId} clipId={clipId} />
          <AutoMarkPanel teamId={teamId} editor={editor} auto={auto} threshold={threshold} canSetThreshold={can(CAN.runFits)} />
          <CalibrationCard
            editor={editor}
            teamId={teamId}
            clipId={clipId}
            saved={data.savedCalibration}
            transform={transformResult}
            frameSize={{ width: clip.frameWidth, height: clip.frameHeight }}
          />
          <PreviewLegend preview={preview} markCount={markCount} calibrated={!!transform} />
        </aside>
      </div>
      <MarksLedger editor={editor} teamId={teamId} transform={transform} saving={saving} threshold={threshold} offCurve={offCurve} />
      <ToolDialogs editor={editor} />
      <ShortcutHelpDialog open={helpOpen} onClose={() => setHelpOpen(false)} />
    </section>
  );
}
