// Snap on the pixels the browser already has: copy a small patch of the
// decoded frame into a canvas and run the shared centroid snap on it (the
// same function the server's snap endpoint runs on the stored frame).
import { SNAP_WINDOW_PX } from '@shared/defaults';
import { snapToCentroid } from '@shared/marking/snap';
import type { Point } from './types';

/** Patch copied around the click: room for the window to re-centre a few pixels. */
const PATCH_PX = 64;
/** Below this confidence the snap is not trusted and the click stays as placed. */
const MIN_CONFIDENCE = 0.2;

let canvas: HTMLCanvasElement | null = null;

export function snapOnImage(image: CanvasImageSource & { naturalWidth?: number; naturalHeight?: number; width: number; height: number }, click: Point, dark = true): Point | null {
  const width = image.naturalWidth || image.width;
  const height = image.naturalHeight || image.height;
  const u0 = Math.max(0, Math.min(width - PATCH_PX, Math.floor(click.u) - PATCH_PX / 2));
  const v0 = Math.max(0, Math.min(height - PATCH_PX, Math.floor(click.v) - PATCH_PX / 2));
  const w = Math.min(PATCH_PX, width);
  const h = Math.min(PATCH_PX, height);
  canvas ??= document.createElement('canvas');
  canvas.width = w;
  canvas.height = h;
  const ctx = canvas.getContext('2d', { willReadFrequently: true });
  if (!ctx) return null;
  ctx.drawImage(image, u0, v0, w, h, 0, 0, w, h);
  const data = ctx.getImageData(0, 0, w, h).data;
  const result = snapToCentroid({ width: w, height: h, data, channels: 4 }, click.u - u0, click.v - v0, { windowPx: SNAP_WINDOW_PX, dark });
  if (!result || result.confidence < MIN_CONFIDENCE) return null;
  return { u: result.u + u0, v: result.v + v0 };
}
