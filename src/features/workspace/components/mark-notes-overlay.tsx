import { Circle, Group, Text } from 'react-konva';
import { imageToScreen } from '../editor/tools/view-behaviour';
import type { ViewTransform } from '../editor/types';
import { MARK_RADIUS_PX, STAGE } from './stage-colours';

/** A word (and a shape) beside a mark: how sure the automatic marker was, or that the mark sits off the preview curve. */
export interface MarkNote {
  frameNumber: number;
  uPx: number;
  vPx: number;
  text: string;
  /** 'auto': a confident automatic mark; 'check': flagged for review; 'off-curve': residual out of line. */
  kind: 'auto' | 'check' | 'off-curve';
}

interface MarkNotesOverlayProps {
  notes: MarkNote[];
  view: ViewTransform;
}

/**
 * Never colour alone: an automatic mark gets a dotted outer ring and its words;
 * one to check a dashed ring and a "?"; one off the curve a "!" in alert red.
 */
export function MarkNotesOverlay({ notes, view }: MarkNotesOverlayProps) {
  return (
    <Group listening={false}>
      {notes.map((n) => {
        const p = imageToScreen(view, { u: n.uPx, v: n.vPx });
        const r = MARK_RADIUS_PX + 4;
        const colour = n.kind === 'off-curve' ? STAGE.alert : n.kind === 'check' ? STAGE.signal : STAGE.fit;
        const mark = n.kind === 'off-curve' ? '! ' : n.kind === 'check' ? '? ' : '';
        return (
          <Group key={`${n.kind}-${n.frameNumber}`} x={p.x} y={p.y}>
            <Circle radius={r} stroke={colour} strokeWidth={1.5} dash={n.kind === 'auto' ? [1.5, 3] : [4, 3]} />
            <Text x={r + 3} y={n.kind === 'off-curve' ? 4 : -14} text={`${mark}${n.text}`} fontSize={12} fontStyle="bold" fill={colour} stroke={STAGE.paper} strokeWidth={3} fillAfterStrokeEnabled />
          </Group>
        );
      })}
    </Group>
  );
}
