import { Group, Line } from 'react-konva';
import type { CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { FlightPreview, WorldPathPoint } from '../editor/flight-preview';
import { imageToScreen } from '../editor/tools/view-behaviour';
import type { ViewTransform } from '../editor/types';
import { Crosshair } from './mark-glyphs';
import { STAGE } from './stage-colours';

interface PreviewOverlayProps {
  preview: FlightPreview | null;
  transform: CalibrationTransform | null;
  view: ViewTransform;
}

/** Fitted drag curve in teal (solid), drag-free curve in violet (dashed), each with its predicted next position. */
export function PreviewOverlay({ preview, transform, view }: PreviewOverlayProps) {
  if (!preview || !transform) return null;
  const toScreen = (w: WorldPathPoint) => imageToScreen(view, transform.worldToImage({ x: w.xM, y: w.yM }));
  const flat = (path: WorldPathPoint[]) => path.flatMap((w) => {
    const p = toScreen(w);
    return [p.x, p.y];
  });
  const freeNext = preview.dragFree.next ? toScreen(preview.dragFree.next) : null;
  const dragNext = preview.drag?.next ? toScreen(preview.drag.next) : null;
  return (
    <Group listening={false}>
      <Line points={flat(preview.dragFree.path)} stroke={STAGE.vacuum} strokeWidth={1.5} dash={[6, 4]} opacity={0.9} />
      {freeNext && <Crosshair x={freeNext.x} y={freeNext.y} colour={STAGE.vacuum} dashed />}
      {preview.drag && (
        <>
          <Line points={flat(preview.drag.path)} stroke={STAGE.fit} strokeWidth={1.75} opacity={0.95} />
          {dragNext && <Crosshair x={dragNext.x} y={dragNext.y} colour={STAGE.fit} />}
        </>
      )}
    </Group>
  );
}
