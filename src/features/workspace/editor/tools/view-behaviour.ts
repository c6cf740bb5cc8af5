// Pan and zoom, shared by every tool: the wheel zooms about the cursor, a
// middle-button drag or a drag with Space held pans. Pure functions over the
// view transform (screen = image * zoom + pan).
import type { Point, ViewTransform } from '../types';

export const MIN_ZOOM = 0.05;
export const MAX_ZOOM = 32;

export interface Size {
  width: number;
  height: number;
}

/** Largest zoom at which the whole frame fits, centred, with a small margin. */
export function fitToWindow(image: Size, viewport: Size, marginPx = 8): ViewTransform {
  const zoom = Math.max(
    MIN_ZOOM,
    Math.min((viewport.width - 2 * marginPx) / image.width, (viewport.height - 2 * marginPx) / image.height),
  );
  return { zoom, panX: (viewport.width - image.width * zoom) / 2, panY: (viewport.height - image.height * zoom) / 2 };
}

export function screenToImage(view: ViewTransform, screen: { x: number; y: number }): Point {
  return { u: (screen.x - view.panX) / view.zoom, v: (screen.y - view.panY) / view.zoom };
}

export function imageToScreen(view: ViewTransform, p: Point): { x: number; y: number } {
  return { x: p.u * view.zoom + view.panX, y: p.v * view.zoom + view.panY };
}

/** Zoom by a factor keeping the image point under the cursor where it is. */
export function zoomAtCursor(view: ViewTransform, cursor: { x: number; y: number }, factor: number): ViewTransform {
  const zoom = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, view.zoom * factor));
  const anchor = screenToImage(view, cursor);
  return { zoom, panX: cursor.x - anchor.u * zoom, panY: cursor.y - anchor.v * zoom };
}

/** Wheel delta (pixels, positive = away from the user) to a zoom factor; one notch (100 px) is about x1.25. */
export function wheelZoomFactor(deltaY: number): number {
  return Math.exp(-deltaY * 0.00223);
}

export type PanState = { phase: 'still' } | { phase: 'panning'; startScreen: { x: number; y: number }; startView: ViewTransform };

export type PanEvent =
  | { type: 'press'; screen: { x: number; y: number }; button: number; spaceHeld: boolean; handTool: boolean }
  | { type: 'move'; screen: { x: number; y: number } }
  | { type: 'release' };

/** Returns the new pan state and, while panning, the view to show; `claimed` says the press belongs to panning, not to the tool. */
export function panTransition(state: PanState, event: PanEvent, view: ViewTransform): { state: PanState; view: ViewTransform; claimed: boolean } {
  switch (event.type) {
    case 'press': {
      const pans = event.button === 1 || (event.button === 0 && (event.spaceHeld || event.handTool));
      if (!pans) return { state, view, claimed: false };
      return { state: { phase: 'panning', startScreen: event.screen, startView: view }, view, claimed: true };
    }
    case 'move': {
      if (state.phase !== 'panning') return { state, view, claimed: false };
      const dx = event.screen.x - state.startScreen.x;
      const dy = event.screen.y - state.startScreen.y;
      return { state, view: { ...state.startView, panX: state.startView.panX + dx, panY: state.startView.panY + dy }, claimed: true };
    }
    case 'release':
      return { state: { phase: 'still' }, view, claimed: state.phase === 'panning' };
  }
}
