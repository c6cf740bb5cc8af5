import { Circle, Group, Image as KonvaImage, Line } from 'react-konva';
import type { Point } from '../editor/types';
import { STAGE } from './stage-colours';

interface LoupeProps {
  image: HTMLImageElement;
  /** Cursor on screen and the image point under it. */
  screen: { x: number; y: number };
  point: Point;
  zoom: number;
  viewport: { width: number; height: number };
}

const RADIUS = 60;
const OFFSET = 84;
/** The loupe shows the frame four times larger than the view, but never more than 24 screen px per frame pixel. */
const MAGNIFY = 4;
const MAX_PX_PER_PIXEL = 24;

/** A round magnifier beside the cursor (moved to the other side near an edge), with a hairline crosshair on the point under the cursor. */
export function Loupe({ image, screen, point, zoom, viewport }: LoupeProps) {
  const scale = Math.min(zoom * MAGNIFY, MAX_PX_PER_PIXEL);
  const cx = screen.x + (screen.x + OFFSET + RADIUS > viewport.width ? -OFFSET : OFFSET);
  const cy = screen.y + (screen.y - OFFSET - RADIUS < 0 ? OFFSET : -OFFSET);
  return (
    <Group listening={false}>
      <Circle x={cx} y={cy} radius={RADIUS + 2} fill={STAGE.ink} opacity={0.85} />
      <Group
        clipFunc={(ctx) => {
          ctx.arc(cx, cy, RADIUS, 0, Math.PI * 2, false);
        }}
      >
        <KonvaImage image={image} x={cx - point.u * scale} y={cy - point.v * scale} scaleX={scale} scaleY={scale} />
      </Group>
      <Line points={[cx - RADIUS, cy, cx - 4, cy]} stroke={STAGE.signal} strokeWidth={1} />
      <Line points={[cx + 4, cy, cx + RADIUS, cy]} stroke={STAGE.signal} strokeWidth={1} />
      <Line points={[cx, cy - RADIUS, cx, cy - 4]} stroke={STAGE.signal} strokeWidth={1} />
      <Line points={[cx, cy + 4, cx, cy + RADIUS]} stroke={STAGE.signal} strokeWidth={1} />
      <Circle x={cx} y={cy} radius={RADIUS} stroke={STAGE.paper} strokeWidth={1.5} />
    </Group>
  );
}
