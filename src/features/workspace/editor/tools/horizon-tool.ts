// "Horizon": two clicks along something truly level (a spirit-levelled bar,
// a water line) give the camera's roll; or the roll is typed as an angle.
import { distancePx, unchanged, type Tool, type ToolResult } from './tool-types';
import type { Point } from '../types';

export type HorizonState =
  | { phase: 'idle' }
  | { phase: 'first-point'; a: Point; hover: Point | null }
  | { phase: 'typing-angle' };

const MIN_LINE_PX = 5;

export const horizonTool: Tool<HorizonState> = {
  initial: { phase: 'idle' },
  transition(state, event): ToolResult<HorizonState> {
    if (event.type === 'cancel') return { state: { phase: 'idle' }, effects: state.phase === 'typing-angle' ? [{ type: 'close-dialog' }] : [] };
    // "A" types the angle instead of clicking a line.
    if (event.type === 'key' && (event.key === 'a' || event.key === 'A') && state.phase !== 'typing-angle') {
      return { state: { phase: 'typing-angle' }, effects: [{ type: 'open-dialog', dialog: 'level-angle' }] };
    }
    switch (state.phase) {
      case 'idle':
        if (event.type === 'pointer-down' && event.button === 0) return { state: { phase: 'first-point', a: event.point, hover: null }, effects: [] };
        return unchanged(state);
      case 'first-point':
        if (event.type === 'pointer-move') return { state: { ...state, hover: event.point }, effects: [] };
        if (event.type === 'pointer-down' && event.button === 0) {
          if (distancePx(state.a, event.point) < MIN_LINE_PX) return unchanged(state);
          return { state: { phase: 'idle' }, effects: [{ type: 'set-level', level: { kind: 'line', p1: state.a, p2: event.point } }] };
        }
        return unchanged(state);
      case 'typing-angle': {
        if (event.type !== 'submit') return unchanged(state);
        const { angleDeg } = event.values;
        if (!Number.isFinite(angleDeg) || Math.abs(angleDeg) >= 45) return unchanged(state);
        return { state: { phase: 'idle' }, effects: [{ type: 'set-level', level: { kind: 'angle', rollDeg: angleDeg } }, { type: 'close-dialog' }] };
      }
    }
  },
};
