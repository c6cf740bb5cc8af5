import { Circle, Group, Line } from 'react-konva';
import { MARK_RADIUS_PX, STAGE } from './stage-colours';

interface MarkGlyphProps {
  x: number;
  y: number;
  snapped: boolean;
  opacity?: number;
  emphasis?: boolean;
}

/** An open amber ring with a 1 px ink centre dot; a snapped mark wears a small teal tick at the top. */
export function MarkGlyph({ x, y, snapped, opacity = 1, emphasis = false }: MarkGlyphProps) {
  const r = MARK_RADIUS_PX;
  return (
    <Group x={x} y={y} opacity={opacity} listening={false}>
      {/* A faint paper halo keeps the ring readable on dark and busy backgrounds. */}
      <Circle radius={r + 1.5} stroke={STAGE.paper} strokeWidth={1} opacity={0.55} />
      <Circle radius={r} stroke={STAGE.signal} strokeWidth={emphasis ? 2.5 : 2} />
      <Circle radius={0.5} fill={STAGE.ink} />
      {snapped && <Line points={[0, -r - 1, 0, -r - 6]} stroke={STAGE.fit} strokeWidth={2} lineCap="round" />}
    </Group>
  );
}

/** A small crosshair for a predicted position. */
export function Crosshair({ x, y, colour, dashed = false }: { x: number; y: number; colour: string; dashed?: boolean }) {
  const s = 6;
  return (
    <Group x={x} y={y} listening={false}>
      <Line points={[-s, 0, s, 0]} stroke={colour} strokeWidth={1.5} dash={dashed ? [2, 2] : undefined} />
      <Line points={[0, -s, 0, s]} stroke={colour} strokeWidth={1.5} dash={dashed ? [2, 2] : undefined} />
    </Group>
  );
}
