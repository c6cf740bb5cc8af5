// "Plane fix": click four corners of a rectangle of known size lying in the
// flight plane (in order around it), then type its width and height. Used
// when the camera is not square to the flight plane.
import { unchanged, type Tool, type ToolResult } from './tool-types';
import type { Point } from '../types';

export type PlaneFixState =
  | { phase: 'collecting'; corners: Point[]; hover: Point | null }
  | { phase: 'awaiting-size'; corners: [Point, Point, Point, Point] };

const MIN_CORNER_GAP_PX = 5;

export const planeFixTool: Tool<PlaneFixState> = {
  initial: { phase: 'collecting', corners: [], hover: null },
  transition(state, event): ToolResult<PlaneFixState> {
    const reset: PlaneFixState = { phase: 'collecting', corners: [], hover: null };
    if (event.type === 'cancel') return { state: reset, effects: state.phase === 'awaiting-size' ? [{ type: 'close-dialog' }] : [] };
    if (state.phase === 'collecting') {
      if (event.type === 'pointer-move') return { state: { ...state, hover: event.point }, effects: [] };
      if (event.type === 'key' && event.key === 'Backspace') return { state: { ...state, corners: state.corners.slice(0, -1) }, effects: [] };
      if (event.type !== 'pointer-down' || event.button !== 0) return unchanged(state);
      const tooClose = state.corners.some((c) => Math.hypot(c.u - event.point.u, c.v - event.point.v) < MIN_CORNER_GAP_PX);
      if (tooClose) return unchanged(state);
      const corners = [...state.corners, event.point];
      if (corners.length < 4) return { state: { phase: 'collecting', corners, hover: null }, effects: [] };
      return { state: { phase: 'awaiting-size', corners: corners as [Point, Point, Point, Point] }, effects: [{ type: 'open-dialog', dialog: 'plane-size' }] };
    }
    if (event.type !== 'submit') return unchanged(state);
    const { widthM, heightM } = event.values;
    if (!(widthM > 0) || !(heightM > 0)) return unchanged(state);
    return { state: reset, effects: [{ type: 'set-plane', plane: { corners: state.corners, widthM, heightM } }, { type: 'close-dialog' }] };
  },
};
