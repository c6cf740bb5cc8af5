import { Group } from 'react-konva';
import type { PlaceState } from '../editor/tools/place-tool';
import { imageToScreen } from '../editor/tools/view-behaviour';
import type { EditorMark, ViewTransform } from '../editor/types';
import { MarkGlyph } from './mark-glyphs';

/** How many earlier marks the trail shows, and how strongly each (newest first). */
const TRAIL_OPACITY = [0.8, 0.62, 0.46, 0.32, 0.2];

interface MarksOverlayProps {
  marks: Record<number, EditorMark> | undefined;
  frameNumber: number;
  view: ViewTransform;
  dragging: PlaceState;
}

/** The mark on the shown frame, and a trail fading over the five marks before it. */
export function MarksOverlay({ marks, frameNumber, view, dragging }: MarksOverlayProps) {
  if (!marks) return null;
  const earlier = Object.values(marks)
    .filter((m) => m.frameNumber < frameNumber)
    .sort((a, b) => b.frameNumber - a.frameNumber)
    .slice(0, TRAIL_OPACITY.length);
  const current = marks[frameNumber];
  const drag = dragging.phase === 'dragging' && dragging.frameNumber === frameNumber ? dragging : null;
  const here = drag ? { u: drag.current.u, v: drag.current.v } : current ? { u: current.uPx, v: current.vPx } : null;
  const hereScreen = here ? imageToScreen(view, here) : null;
  return (
    <Group listening={false}>
      {earlier.map((m, i) => {
        const p = imageToScreen(view, { u: m.uPx, v: m.vPx });
        return <MarkGlyph key={m.frameNumber} x={p.x} y={p.y} snapped={m.snapped} opacity={TRAIL_OPACITY[i]} />;
      })}
      {hereScreen && <MarkGlyph x={hereScreen.x} y={hereScreen.y} snapped={!drag && !!current?.snapped} emphasis />}
    </Group>
  );
}
