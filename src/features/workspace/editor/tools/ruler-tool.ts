// "Ruler": click both ends of the scale reference, then type its known length
// and the tolerance of that length.
import { distancePx, unchanged, type Tool, type ToolResult } from './tool-types';
import type { Point } from '../types';

export type RulerState =
  | { phase: 'idle' }
  | { phase: 'first-end'; a: Point; hover: Point | null }
  | { phase: 'awaiting-length'; a: Point; b: Point };

/** Two ends closer than this cannot give a usable scale. */
export const MIN_REFERENCE_PX = 5;

export const rulerTool: Tool<RulerState> = {
  initial: { phase: 'idle' },
  transition(state, event): ToolResult<RulerState> {
    if (event.type === 'cancel') return { state: { phase: 'idle' }, effects: state.phase === 'awaiting-length' ? [{ type: 'close-dialog' }] : [] };
    switch (state.phase) {
      case 'idle':
        if (event.type === 'pointer-down' && event.button === 0) return { state: { phase: 'first-end', a: event.point, hover: null }, effects: [] };
        return unchanged(state);
      case 'first-end':
        if (event.type === 'pointer-move') return { state: { ...state, hover: event.point }, effects: [] };
        if (event.type === 'pointer-down' && event.button === 0) {
          if (distancePx(state.a, event.point) < MIN_REFERENCE_PX) return unchanged(state);
          return { state: { phase: 'awaiting-length', a: state.a, b: event.point }, effects: [{ type: 'open-dialog', dialog: 'scale-length' }] };
        }
        return unchanged(state);
      case 'awaiting-length': {
        if (event.type !== 'submit') return unchanged(state);
        const { lengthM, toleranceM } = event.values;
        if (!(lengthM > 0) || !(toleranceM >= 0)) return unchanged(state);
        return {
          state: { phase: 'idle' },
          effects: [{ type: 'set-scale', scale: { p1: state.a, p2: state.b, lengthM, lengthTolM: toleranceM } }, { type: 'close-dialog' }],
        };
      }
    }
  },
};
