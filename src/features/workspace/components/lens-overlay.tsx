import { useMemo } from 'react';
import { Circle, Group, Line, Text } from 'react-konva';
import { lensModelForFrame } from '@shared/geometry/lens-distortion';
import { lensGridLines } from '../editor/lens-grid';
import type { StraightEdgeState } from '../editor/tools/straight-edge-tool';
import { imageToScreen } from '../editor/tools/view-behaviour';
import type { LensDraft, Point, ViewTransform } from '../editor/types';
import { STAGE } from './stage-colours';

interface LensOverlayProps {
  lens: LensDraft | null;
  straightLines: Point[][];
  view: ViewTransform;
  /** The corrected grid is switched on (it is drawn only when there is a lens to draw it through). */
  gridOn: boolean;
  /** The straight-edge tool's edge in progress; null when another tool is active. */
  edgeInProgress: StraightEdgeState | null;
}

const halo = { shadowColor: STAGE.paper, shadowBlur: 2, shadowOpacity: 0.9 };

/**
 * What the lens correction says, drawn on the frame: a grid of world-straight
 * lines as the lens shows them (teal: the model's word), over the edges the
 * person clicked (amber: what a person did). Where the correction is right,
 * the grid bows with the rails.
 */
export function LensOverlay({ lens, straightLines, view, gridOn, edgeInProgress }: LensOverlayProps) {
  const grid = useMemo(() => {
    if (!gridOn || !lens) return [];
    const model = lensModelForFrame(lens.frameWidthPx, lens.frameHeightPx, lens);
    return lensGridLines(model, { width: lens.frameWidthPx, height: lens.frameHeightPx });
  }, [gridOn, lens]);
  const flat = (points: Point[]) => points.flatMap((p) => {
    const s = imageToScreen(view, p);
    return [s.x, s.y];
  });
  const showEdges = gridOn || edgeInProgress !== null;
  const pending = edgeInProgress ? [...edgeInProgress.points, ...(edgeInProgress.hover && edgeInProgress.points.length ? [edgeInProgress.hover] : [])] : [];

  return (
    <Group listening={false}>
      {grid.map((l, i) => (
        <Line key={`g${i}`} points={flat(l.points)} stroke={STAGE.fit} strokeWidth={l.idealOffsetPx === 0 ? 1.5 : 1} opacity={0.75} lineJoin="round" />
      ))}
      {showEdges && straightLines.map((line, i) => <Edge key={`e${i}`} points={line} index={i + 1} view={view} />)}
      {pending.length > 0 && (
        <Group>
          <Line points={flat(pending)} stroke={STAGE.signal} strokeWidth={1.5} dash={[5, 3]} />
          {edgeInProgress!.points.map((p, i) => {
            const s = imageToScreen(view, p);
            return <Circle key={i} x={s.x} y={s.y} radius={3} stroke={STAGE.signal} strokeWidth={1.5} />;
          })}
        </Group>
      )}
    </Group>
  );
}

function Edge({ points, index, view }: { points: Point[]; index: number; view: ViewTransform }) {
  const s = points.map((p) => imageToScreen(view, p));
  return (
    <Group>
      <Line points={s.flatMap((p) => [p.x, p.y])} stroke={STAGE.paper} strokeWidth={4} opacity={0.5} />
      <Line points={s.flatMap((p) => [p.x, p.y])} stroke={STAGE.signal} strokeWidth={1.5} />
      {s.map((p, i) => (
        <Circle key={i} x={p.x} y={p.y} radius={3} fill={STAGE.signal} stroke={STAGE.ink} strokeWidth={0.5} />
      ))}
      <Text x={s[0].x + 5} y={s[0].y - 16} text={`edge ${index}`} fontSize={11} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />
    </Group>
  );
}
