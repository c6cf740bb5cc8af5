// "Place": click to put the active track's mark on this frame and move on to
// the next frame; press on an existing mark and drag to adjust it; Delete
// removes the mark on this frame.
import { distancePx, unchanged, type Tool, type ToolResult } from './tool-types';
import type { Point } from '../types';

export type PlaceState =
  | { phase: 'idle' }
  | { phase: 'dragging'; trackId: string; frameNumber: number; from: Point; current: Point; moved: boolean };

/** A press that travels less than this (image px) is a click on the mark, not a drag. */
const DRAG_THRESHOLD_PX = 0.5;

export const placeTool: Tool<PlaceState> = {
  initial: { phase: 'idle' },
  transition(state, event, ctx): ToolResult<PlaceState> {
    switch (event.type) {
      case 'pointer-down': {
        if (event.button !== 0 || !ctx.activeTrackId) return unchanged(state);
        const mark = ctx.markOnFrame;
        if (mark && distancePx({ u: mark.uPx, v: mark.vPx }, event.point) <= ctx.grabRadiusPx) {
          const from = { u: mark.uPx, v: mark.vPx };
          return { state: { phase: 'dragging', trackId: mark.trackId, frameNumber: mark.frameNumber, from, current: from, moved: false }, effects: [] };
        }
        return { state: { phase: 'idle' }, effects: [{ type: 'place-mark', point: event.point }, { type: 'step', by: 1 }] };
      }
      case 'pointer-move': {
        if (state.phase !== 'dragging') return unchanged(state);
        const moved = state.moved || distancePx(state.from, event.point) >= DRAG_THRESHOLD_PX;
        return { state: { ...state, current: event.point, moved }, effects: [] };
      }
      case 'pointer-up': {
        if (state.phase !== 'dragging') return unchanged(state);
        const moved = state.moved || distancePx(state.from, event.point) >= DRAG_THRESHOLD_PX;
        const effects = moved
          ? [{ type: 'move-mark' as const, trackId: state.trackId, frameNumber: state.frameNumber, to: event.point }]
          : [];
        return { state: { phase: 'idle' }, effects };
      }
      case 'key': {
        if ((event.key === 'Delete' || event.key === 'Backspace') && ctx.markOnFrame) {
          return { state: { phase: 'idle' }, effects: [{ type: 'delete-mark', trackId: ctx.markOnFrame.trackId, frameNumber: ctx.markOnFrame.frameNumber }] };
        }
        return unchanged(state);
      }
      case 'cancel':
        return { state: { phase: 'idle' }, effects: [] };
      default:
        return unchanged(state);
    }
  },
};
