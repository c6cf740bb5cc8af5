// "Origin pin": one click puts the world origin (x right, y up) at that pixel.
import { unchanged, type Tool } from './tool-types';

export type OriginState = { phase: 'idle' };

export const originTool: Tool<OriginState> = {
  initial: { phase: 'idle' },
  transition(state, event) {
    if (event.type === 'pointer-down' && event.button === 0) return { state, effects: [{ type: 'set-origin', origin: event.point }] };
    return unchanged(state);
  },
};
