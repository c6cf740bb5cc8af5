import { Arrow, Group, Line, Text } from 'react-konva';
import { rollFromLevelLine } from '@shared/geometry/calibration-transform';
import type { ToolStates } from '../editor/editor-store';
import { imageToScreen } from '../editor/tools/view-behaviour';
import type { CalibrationDraft, Point, ToolId, ViewTransform } from '../editor/types';
import { STAGE } from './stage-colours';

interface CalibrationOverlayProps {
  draft: CalibrationDraft;
  view: ViewTransform;
  activeTool: ToolId;
  toolStates: ToolStates;
}

const halo = { shadowColor: STAGE.paper, shadowBlur: 2, shadowOpacity: 0.9 };

function rollDegOf(draft: CalibrationDraft): number {
  if (!draft.level) return 0;
  return draft.level.kind === 'angle' ? draft.level.rollDeg : rollFromLevelLine(draft.level.p1, draft.level.p2);
}

/** Scale bar with end ticks and its length, origin cross with x/y arrows, level line, plane rectangle, and whatever a tool is halfway through. */
export function CalibrationOverlay({ draft, view, activeTool, toolStates }: CalibrationOverlayProps) {
  const s = (p: Point) => imageToScreen(view, p);
  return (
    <Group listening={false}>
      {draft.plane && <Quad corners={draft.plane.corners.map(s)} closed label={`${draft.plane.widthM} × ${draft.plane.heightM} m`} />}
      {draft.level?.kind === 'line' && <DashedSegment a={s(draft.level.p1)} b={s(draft.level.p2)} label="level" />}
      {draft.scale && (
        <ScaleBar a={s(draft.scale.p1)} b={s(draft.scale.p2)} label={`${draft.scale.lengthM} m${draft.scale.lengthTolM ? ` ± ${draft.scale.lengthTolM * 1000} mm` : ''}`} />
      )}
      {draft.origin && <OriginCross at={s(draft.origin)} rollDeg={rollDegOf(draft)} mirror={draft.downrange === 'left'} />}
      <ToolDraft view={view} activeTool={activeTool} toolStates={toolStates} />
    </Group>
  );
}

function ToolDraft({ view, activeTool, toolStates }: { view: ViewTransform; activeTool: ToolId; toolStates: ToolStates }) {
  const s = (p: Point) => imageToScreen(view, p);
  if (activeTool === 'ruler') {
    const t = toolStates.ruler;
    if (t.phase === 'first-end') return <ScaleBar a={s(t.a)} b={s(t.hover ?? t.a)} pending />;
    if (t.phase === 'awaiting-length') return <ScaleBar a={s(t.a)} b={s(t.b)} pending />;
  }
  if (activeTool === 'horizon' && toolStates.horizon.phase === 'first-point') {
    const t = toolStates.horizon;
    return <DashedSegment a={s(t.a)} b={s(t.hover ?? t.a)} pending />;
  }
  if (activeTool === 'plane-fix') {
    const t = toolStates['plane-fix'];
    const corners = t.phase === 'collecting' ? [...t.corners, ...(t.hover && t.corners.length ? [t.hover] : [])] : t.corners;
    if (corners.length) return <Quad corners={corners.map(s)} closed={t.phase === 'awaiting-size'} pending />;
  }
  return null;
}

type XY = { x: number; y: number };

function ScaleBar({ a, b, label, pending = false }: { a: XY; b: XY; label?: string; pending?: boolean }) {
  const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
  const nx = (-(b.y - a.y) / len) * 7;
  const ny = ((b.x - a.x) / len) * 7;
  const colour = pending ? STAGE.signal : STAGE.ink;
  return (
    <Group>
      <Line points={[a.x, a.y, b.x, b.y]} stroke={STAGE.paper} strokeWidth={5} opacity={0.6} />
      <Line points={[a.x, a.y, b.x, b.y]} stroke={colour} strokeWidth={2} dash={pending ? [5, 3] : undefined} />
      <Line points={[a.x - nx, a.y - ny, a.x + nx, a.y + ny]} stroke={colour} strokeWidth={2} />
      <Line points={[b.x - nx, b.y - ny, b.x + nx, b.y + ny]} stroke={colour} strokeWidth={2} />
      {label && <Text x={(a.x + b.x) / 2 + nx * 1.6} y={(a.y + b.y) / 2 + ny * 1.6 - 7} text={label} fontSize={12} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />}
    </Group>
  );
}

function DashedSegment({ a, b, label, pending = false }: { a: XY; b: XY; label?: string; pending?: boolean }) {
  return (
    <Group>
      <Line points={[a.x, a.y, b.x, b.y]} stroke={pending ? STAGE.signal : STAGE.ink} strokeWidth={1.5} dash={[8, 4]} />
      {label && <Text x={b.x + 6} y={b.y - 14} text={label} fontSize={12} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />}
    </Group>
  );
}

function Quad({ corners, closed, label, pending = false }: { corners: XY[]; closed: boolean; label?: string; pending?: boolean }) {
  return (
    <Group>
      <Line points={corners.flatMap((c) => [c.x, c.y])} closed={closed} stroke={pending ? STAGE.signal : STAGE.ink} strokeWidth={1.5} dash={[4, 3]} />
      {corners.map((c, i) => (
        <Text key={i} x={c.x + 4} y={c.y + 4} text={String(i + 1)} fontSize={11} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />
      ))}
      {label && corners[0] && <Text x={corners[0].x + 4} y={corners[0].y - 16} text={label} fontSize={12} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />}
    </Group>
  );
}

/** Ink cross; x arrow amber (downrange), y arrow teal (up), turned by the camera roll. */
function OriginCross({ at, rollDeg, mirror }: { at: XY; rollDeg: number; mirror: boolean }) {
  const r = (rollDeg * Math.PI) / 180;
  const L = 36;
  // World x on screen: (cos r, -sin r); world y (up): (-sin r, -cos r) — screen v points down.
  const xDir = { x: Math.cos(r) * (mirror ? -1 : 1), y: -Math.sin(r) * (mirror ? -1 : 1) };
  const yDir = { x: -Math.sin(r), y: -Math.cos(r) };
  return (
    <Group>
      <Line points={[at.x - 8, at.y, at.x + 8, at.y]} stroke={STAGE.ink} strokeWidth={2} />
      <Line points={[at.x, at.y - 8, at.x, at.y + 8]} stroke={STAGE.ink} strokeWidth={2} />
      <Arrow points={[at.x, at.y, at.x + xDir.x * L, at.y + xDir.y * L]} stroke={STAGE.signal} fill={STAGE.signal} strokeWidth={2} pointerLength={6} pointerWidth={6} />
      <Arrow points={[at.x, at.y, at.x + yDir.x * L, at.y + yDir.y * L]} stroke={STAGE.fit} fill={STAGE.fit} strokeWidth={2} pointerLength={6} pointerWidth={6} />
      <Text x={at.x + xDir.x * (L + 8) - 3} y={at.y + xDir.y * (L + 8) - 6} text="x" fontSize={12} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />
      <Text x={at.x + yDir.x * (L + 8) - 3} y={at.y + yDir.y * (L + 8) - 6} text="y" fontSize={12} fontFamily="Work Sans" fill={STAGE.ink} {...halo} />
    </Group>
  );
}
