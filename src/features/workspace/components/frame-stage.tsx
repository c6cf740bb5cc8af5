import { useEffect, useReducer, useRef, useState, type MutableRefObject } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import type Konva from 'konva';
import type { CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { Editor } from '../editor/editor-store';
import type { FlightPreview } from '../editor/flight-preview';
import type { FrameCache } from '../editor/frame-cache';
import { fitToWindow, panTransition, screenToImage, wheelZoomFactor, zoomAtCursor, type PanState } from '../editor/tools/view-behaviour';
import { useEditor } from '../hooks/use-editor';
import { CalibrationOverlay } from './calibration-overlay';
import { LensOverlay } from './lens-overlay';
import { Loupe } from './loupe';
import { useMarkNotes } from '../hooks/use-mark-notes';
import { MarkNotesOverlay } from './mark-notes-overlay';
import { MarksOverlay } from './marks-overlay';
import { PreviewOverlay } from './preview-overlay';
import { recordFrameDrawn, recordStepKey } from './frame-timings';

const NO_FRAMES = new Set<number>();

interface FrameStageProps {
  editor: Editor;
  frameCache: FrameCache<HTMLImageElement>;
  imageSize: { width: number; height: number };
  transform: CalibrationTransform | null;
  preview: FlightPreview | null;
  spaceHeld: MutableRefObject<boolean>;
  /** Bumped to ask for fit-to-window again (the "0" key). */
  fitRequest: number;
  /** For the words beside marks: which frames sit off the preview curve, and the team's review threshold. */
  markNotes?: { offCurve: Set<number>; threshold: number };
}

/**
 * The frame and everything drawn on it. Two layers: the frame image alone
 * (redrawn when stepping) and the overlay (marks, calibration, curves, loupe),
 * so stepping repaints one bitmap and the overlay stays cheap.
 */
export function FrameStage({ editor, frameCache, imageSize, transform, preview, spaceHeld, fitRequest, markNotes }: FrameStageProps) {
  const notes = useMarkNotes(editor, markNotes?.offCurve ?? NO_FRAMES, markNotes?.threshold ?? 0);
  const box = useRef<HTMLDivElement>(null);
  const frameLayer = useRef<Konva.Layer>(null);
  const [size, setSize] = useState({ width: 0, height: 0 });
  const [pointer, setPointer] = useState<{ x: number; y: number } | null>(null);
  const pan = useRef<PanState>({ phase: 'still' });
  const [, frameArrived] = useReducer((n: number) => n + 1, 0);

  const frameNumber = useEditor(editor, (s) => s.frameNumber);
  const frames = useEditor(editor, (s) => s.frames);
  const view = useEditor(editor, (s) => s.view);
  const activeTool = useEditor(editor, (s) => s.activeTool);
  const toolStates = useEditor(editor, (s) => s.toolStates);
  const draft = useEditor(editor, (s) => s.calibrationDraft);
  const lensGridOn = useEditor(editor, (s) => s.lensGridOn);
  const activeTrackId = useEditor(editor, (s) => s.activeTrackId);
  const marks = useEditor(editor, (s) => (activeTrackId ? s.marksByTrack[activeTrackId] : undefined));

  // Until the new frame is decoded, keep showing the last one rather than a blank.
  const lastShown = useRef<{ frameNumber: number; image: HTMLImageElement } | null>(null);
  const ready = frameCache.get(frameNumber);
  if (ready) lastShown.current = { frameNumber, image: ready };
  const shown = lastShown.current;

  useEffect(() => frameCache.onReady((n) => n === editor.getState().frameNumber && frameArrived()), [frameCache, editor]);

  // Fast path for stepping: when the frame number changes and the frame is
  // decoded, swap the bitmap and draw the frame layer right inside the key
  // handler, so it is on screen at the very next paint. React re-renders the
  // rest (overlay, readouts) as usual; its later update of the same image is
  // a no-op.
  const imageNode = useRef<Konva.Image>(null);
  useEffect(
    () =>
      editor.subscribe(() => {
        const n = editor.getState().frameNumber;
        if (lastShown.current?.frameNumber === n) return;
        const image = frameCache.get(n);
        const node = imageNode.current;
        const layer = frameLayer.current;
        if (!image || !node || !layer) return;
        lastShown.current = { frameNumber: n, image };
        node.image(image);
        layer.draw();
      }),
    [editor, frameCache],
  );

  useEffect(() => {
    const index = frames.findIndex((f) => f.frameNumber === frameNumber);
    if (index >= 0) frameCache.prefetchAround(frames.map((f) => f.frameNumber), index);
  }, [frameNumber, frames, frameCache]);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const ro = new ResizeObserver(([entry]) => {
      const { width, height } = entry.contentRect;
      setSize({ width: Math.floor(width), height: Math.floor(height) });
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  // Fit once the box has a size, and again on request.
  const fittedFor = useRef<string>('');
  useEffect(() => {
    if (!size.width || !size.height) return;
    const key = `${fitRequest}`;
    if (fittedFor.current === key) return;
    fittedFor.current = key;
    editor.setView(fitToWindow(imageSize, size));
  }, [size, imageSize, fitRequest, editor]);

  // Frame-step timing for `npm run bench`: the moment the frame layer has drawn the new frame.
  // The layer exists only once the box has a size, so the listener is attached again when it first has one.
  const hasSize = size.width > 0;
  useEffect(() => {
    const layer = frameLayer.current;
    if (!layer) return;
    const onDraw = () => recordFrameDrawn(lastShown.current?.frameNumber ?? -1, editor.getState().frameNumber);
    layer.on('draw', onDraw);
    return () => {
      layer.off('draw', onDraw);
    };
  }, [editor, hasSize]);

  const stagePoint = (stage: Konva.Stage | null) => stage?.getPointerPosition() ?? null;

  const onMouseDown = (e: Konva.KonvaEventObject<MouseEvent>) => {
    const p = stagePoint(e.target.getStage());
    if (!p) return;
    box.current?.focus({ preventScroll: true });
    const r = panTransition(pan.current, { type: 'press', screen: p, button: e.evt.button, spaceHeld: spaceHeld.current, handTool: activeTool === 'hand' }, view);
    pan.current = r.state;
    if (r.claimed) {
      e.evt.preventDefault();
      return;
    }
    // A plain click with the place tool marks and steps on: `npm run bench` times it to the next frame drawn.
    if (activeTool === 'place' && e.evt.button === 0) recordStepKey(e.evt.timeStamp);
    editor.toolEvent({ type: 'pointer-down', point: screenToImage(view, p), button: e.evt.button });
  };

  const onMouseMove = (e: Konva.KonvaEventObject<MouseEvent>) => {
    const p = stagePoint(e.target.getStage());
    if (!p) return;
    setPointer(p);
    const r = panTransition(pan.current, { type: 'move', screen: p }, view);
    if (r.claimed) {
      editor.setView(r.view);
      return;
    }
    editor.toolEvent({ type: 'pointer-move', point: screenToImage(view, p) });
  };

  const onMouseUp = (e: Konva.KonvaEventObject<MouseEvent>) => {
    const p = stagePoint(e.target.getStage());
    const r = panTransition(pan.current, { type: 'release' }, view);
    pan.current = r.state;
    if (r.claimed || !p) return;
    editor.toolEvent({ type: 'pointer-up', point: screenToImage(view, p) });
  };

  const onWheel = (e: Konva.KonvaEventObject<WheelEvent>) => {
    e.evt.preventDefault();
    const p = stagePoint(e.target.getStage());
    if (p) editor.setView(zoomAtCursor(view, p, wheelZoomFactor(e.evt.deltaY)));
  };

  const pointerImage = pointer ? screenToImage(view, pointer) : null;
  const showLoupe = !!(shown && pointer && pan.current.phase === 'still' && activeTool !== 'hand');
  const cursor = activeTool === 'hand' || pan.current.phase === 'panning' ? 'grab' : 'crosshair';

  return (
    <div
      ref={box}
      tabIndex={0}
      role="application"
      aria-label={`Frame ${frameNumber}. Click to use the current tool; arrow keys step frames; press ? for all keys.`}
      className="relative h-full min-h-[320px] w-full overflow-hidden rounded-card bg-ink outline-offset-[-3px] focus-visible:outline-3 focus-visible:outline-signal"
      style={{ cursor }}
      data-testid="frame-stage"
      data-zoom={view.zoom}
      data-pan-x={view.panX}
      data-pan-y={view.panY}
      data-frame={frameNumber}
      data-shown-frame={shown?.frameNumber ?? ''}
      data-loupe={showLoupe ? 'on' : 'off'}
      data-lens-grid={lensGridOn && draft.lens ? 'on' : 'off'}
      onContextMenu={(e) => e.preventDefault()}
      onMouseLeave={() => setPointer(null)}
    >
      {size.width > 0 && (
        <Stage width={size.width} height={size.height} onMouseDown={onMouseDown} onMouseMove={onMouseMove} onMouseUp={onMouseUp} onWheel={onWheel}>
          <Layer ref={frameLayer} listening={false} imageSmoothingEnabled={view.zoom < 2}>
            {shown && <KonvaImage ref={imageNode} image={shown.image} x={view.panX} y={view.panY} scaleX={view.zoom} scaleY={view.zoom} />}
          </Layer>
          <Layer listening={false} imageSmoothingEnabled={false}>
            <LensOverlay
              lens={draft.lens}
              straightLines={draft.straightLines}
              view={view}
              gridOn={lensGridOn}
              edgeInProgress={activeTool === 'straight-edge' ? toolStates['straight-edge'] : null}
            />
            <CalibrationOverlay draft={draft} view={view} activeTool={activeTool} toolStates={toolStates} />
            <PreviewOverlay preview={preview} transform={transform} view={view} />
            <MarksOverlay marks={marks} frameNumber={frameNumber} view={view} dragging={toolStates.place} />
            {notes && notes.length > 0 && <MarkNotesOverlay notes={notes} view={view} />}
            {showLoupe && shown && pointer && pointerImage && <Loupe image={shown.image} screen={pointer} point={pointerImage} zoom={view.zoom} viewport={size} />}
          </Layer>
        </Stage>
      )}
      {shown && shown.frameNumber !== frameNumber && (
        <p className="absolute top-2 right-2 rounded bg-ink/80 px-2 py-0.5 text-micro text-paper" role="status">
          Loading frame {frameNumber}…
        </p>
      )}
    </div>
  );
}
