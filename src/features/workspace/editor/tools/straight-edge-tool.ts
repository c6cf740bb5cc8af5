// "Straight edge": click points along something straight in the world (a fence
// rail, a post, a building edge, a taut line) so the lens fit can find the
// distortion that bows it. Enter, or a second click on the last point (what a
// double-click gives), ends the edge; Backspace takes back the last point, and
// from an empty edge reopens the last finished one; Delete clears every edge.
// Finished edges live in the calibration draft (so they survive switching
// tools and undo like any calibration change); only the edge being clicked
// lives here.
import { distancePx, unchanged, type Tool, type ToolContext, type ToolResult } from './tool-types';
import type { Point } from '../types';

export interface StraightEdgeState {
  /** Points of the edge being clicked, in order along it. */
  points: Point[];
  hover: Point | null;
  /** A plain remark on why the last action did nothing (too few points, too many edges). */
  notice: string | null;
}

/** The fit needs 3 points to see a bend (shared/geometry/plumb-line-fit.ts). */
export const MIN_EDGE_POINTS = 3;
/** Limits of the calibration body (shared/schemas/camera.ts). */
export const MAX_EDGE_POINTS = 200;
export const MAX_EDGES = 40;

const EMPTY: StraightEdgeState = { points: [], hover: null, notice: null };

function finish(state: StraightEdgeState, ctx: ToolContext): ToolResult<StraightEdgeState> {
  const { points } = state;
  if (points.length === 0) return unchanged(state);
  if (points.length < MIN_EDGE_POINTS) {
    return { state: { ...state, notice: `A straight edge needs at least ${MIN_EDGE_POINTS} points; this one has ${points.length}.` }, effects: [] };
  }
  const lines = ctx.straightLines ?? [];
  if (lines.length >= MAX_EDGES) return { state: { ...state, notice: `At most ${MAX_EDGES} straight edges; clear some first.` }, effects: [] };
  return { state: EMPTY, effects: [{ type: 'set-straight-lines', lines: [...lines, points] }] };
}

export const straightEdgeTool: Tool<StraightEdgeState> = {
  initial: EMPTY,
  transition(state, event, ctx): ToolResult<StraightEdgeState> {
    const lines = ctx.straightLines ?? [];
    switch (event.type) {
      case 'cancel':
        return state.points.length || state.notice ? { state: EMPTY, effects: [] } : unchanged(state);
      case 'pointer-move':
        return { state: { ...state, hover: event.point }, effects: [] };
      case 'pointer-down': {
        if (event.button !== 0) return unchanged(state);
        const last = state.points.at(-1);
        // A press on the last point (a double-click's second press, or a deliberate repeat) ends the edge.
        if (last && distancePx(last, event.point) <= ctx.grabRadiusPx) return finish(state, ctx);
        if (state.points.length >= MAX_EDGE_POINTS) {
          return { state: { ...state, notice: `At most ${MAX_EDGE_POINTS} points per edge; press Enter to end this one.` }, effects: [] };
        }
        return { state: { points: [...state.points, event.point], hover: null, notice: null }, effects: [] };
      }
      case 'key':
        if (event.key === 'Enter') return finish(state, ctx);
        if (event.key === 'Backspace') {
          if (state.points.length) return { state: { ...state, points: state.points.slice(0, -1), notice: null }, effects: [] };
          const reopened = lines.at(-1);
          if (!reopened) return unchanged(state);
          return {
            state: { points: reopened.slice(0, -1), hover: null, notice: null },
            effects: [{ type: 'set-straight-lines', lines: lines.slice(0, -1) }],
          };
        }
        if (event.key === 'Delete') {
          if (!lines.length && !state.points.length) return unchanged(state);
          return { state: EMPTY, effects: lines.length ? [{ type: 'set-straight-lines', lines: [] }] : [] };
        }
        return unchanged(state);
      default:
        return unchanged(state);
    }
  },
};
