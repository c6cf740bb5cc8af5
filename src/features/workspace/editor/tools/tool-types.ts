// Tools are small pure state machines: (state, event, context) -> {state, effects}.
// They never touch the store; the store interprets the effects. That keeps
// every tool testable without a canvas, a DOM or React.
import type { EditorMark, LevelDraft, PlaneDraft, Point, ScaleDraft } from '../types';

export type ToolEvent =
  | { type: 'pointer-down'; point: Point; button: number }
  | { type: 'pointer-move'; point: Point }
  | { type: 'pointer-up'; point: Point }
  | { type: 'key'; key: string }
  | { type: 'cancel' }
  /** Values typed into the tool's dialog (scale length, level angle, rectangle size). */
  | { type: 'submit'; values: Record<string, number> };

/** What a tool may read about the editor when it reacts to an event. */
export interface ToolContext {
  frameNumber: number;
  activeTrackId: string | null;
  /** The active track's mark on the shown frame, if any. */
  markOnFrame: EditorMark | null;
  /** How far from a mark (in image pixels) a press still grabs it. */
  grabRadiusPx: number;
  /** Straight edges already finished in the calibration draft (the straight-edge tool adds to them). */
  straightLines?: readonly Point[][];
}

export type ToolDialog = 'scale-length' | 'level-angle' | 'plane-size';

export type ToolEffect =
  | { type: 'place-mark'; point: Point }
  | { type: 'move-mark'; trackId: string; frameNumber: number; to: Point }
  | { type: 'delete-mark'; trackId: string; frameNumber: number }
  | { type: 'step'; by: number }
  | { type: 'open-dialog'; dialog: ToolDialog }
  | { type: 'close-dialog' }
  | { type: 'set-scale'; scale: ScaleDraft }
  | { type: 'set-origin'; origin: Point }
  | { type: 'set-level'; level: LevelDraft }
  | { type: 'set-plane'; plane: PlaneDraft }
  | { type: 'set-straight-lines'; lines: Point[][] };

export interface ToolResult<S> {
  state: S;
  effects: ToolEffect[];
}

export interface Tool<S> {
  initial: S;
  transition(state: S, event: ToolEvent, ctx: ToolContext): ToolResult<S>;
}

export function distancePx(a: Point, b: Point): number {
  return Math.hypot(a.u - b.u, a.v - b.v);
}

export const unchanged = <S>(state: S): ToolResult<S> => ({ state, effects: [] });
