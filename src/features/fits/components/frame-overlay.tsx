import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { Circle, Image as KonvaImage, Layer, Line, Stage } from 'react-konva';
import { buildCalibrationTransform, type CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { FitDetail } from '@shared/schemas/fits';
import { frameImageUrl } from '@/api/clips/frame-images';
import type { FitPlots } from '../hooks/use-fit-plots';
import { CHART } from './chart-colours';

/** Width of the element, kept up to date as the layout changes. */
function useWidth<T extends HTMLElement>() {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(el);
    setWidth(el.clientWidth);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

function useImage(url: string) {
  const [image, setImage] = useState<HTMLImageElement | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    const img = new window.Image();
    img.onload = () => setImage(img);
    img.onerror = () => setFailed(true);
    img.src = url;
    return () => {
      img.onload = null;
      img.onerror = null;
    };
  }, [url]);
  return { image, failed };
}

/**
 * The fitted paths drawn back onto a frame of the clip, through the inverse of
 * the calibration the fit used: a reviewer sees at once whether the model
 * follows the projectile in the picture.
 */
export function FrameOverlay({ teamId, fit, plots }: { teamId: string; fit: FitDetail; plots: FitPlots }) {
  const marks = fit.snapshot.marks;
  const frame = marks[Math.floor(marks.length / 2)]?.frameNumber ?? 0;
  const { image, failed } = useImage(frameImageUrl(teamId, fit.clipId, frame));
  const { ref, width } = useWidth<HTMLDivElement>();
  const transform = useMemo(() => {
    try {
      return buildCalibrationTransform(fit.snapshot.calibration.geometry);
    } catch {
      return null;
    }
  }, [fit.snapshot.calibration.geometry]);

  // One wrapper element throughout: the size observer stays attached to it.
  let body: ReactNode;
  if (failed) body = <p className="text-body text-ink-soft">The frame image could not be loaded, so the overlay is not shown.</p>;
  else if (!transform) body = <p className="text-body text-ink-soft">The stored calibration cannot be drawn.</p>;
  else if (!image || width === 0) body = <p className="text-body text-ink-faint">Loading frame {frame}…</p>;
  else body = <OverlayStage image={image} width={width} transform={transform} fit={fit} plots={plots} frame={frame} />;
  return <div ref={ref}>{body}</div>;
}

function OverlayStage({ image, width, transform, fit, plots, frame }: { image: HTMLImageElement; width: number; transform: CalibrationTransform; fit: FitDetail; plots: FitPlots; frame: number }) {
  const marks = fit.snapshot.marks;
  const scale = Math.min(2, width / image.naturalWidth);
  const toPoints = (pts: { xM: number; yM: number }[]) =>
    pts.flatMap((p) => {
      const q = transform.worldToImage({ x: p.xM, y: p.yM });
      return [q.u * scale, q.v * scale];
    });
  return (
    <figure aria-label={`Fit overlaid on frame ${frame}`} data-chart="overlay">
      <Stage width={image.naturalWidth * scale} height={image.naturalHeight * scale}>
        <Layer listening={false}>
          <KonvaImage image={image} width={image.naturalWidth * scale} height={image.naturalHeight * scale} />
          <Line points={toPoints(plots.curves.dragFree)} stroke={CHART.dragFree} strokeWidth={1.5} dash={[6, 4]} />
          <Line points={toPoints(plots.curves.drag)} stroke={CHART.fit} strokeWidth={2} />
          {marks.map((m) => (
            <Circle key={m.frameNumber} x={m.uPx * scale} y={m.vPx * scale} radius={6 * Math.max(scale, 0.5)} stroke={CHART.marks} strokeWidth={1.5} />
          ))}
        </Layer>
      </Stage>
      <figcaption className="mt-1 text-micro text-ink-faint">Frame {frame}: marks (amber rings), drag fit (teal), drag-free fit (violet, dashed).</figcaption>
    </figure>
  );
}
