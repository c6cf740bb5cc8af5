import { describe, expect, it } from 'vitest';
import { straightEdgeTool, MAX_EDGE_POINTS, type StraightEdgeState } from './straight-edge-tool';
import type { ToolContext, ToolEffect, ToolEvent } from './tool-types';
import type { Point } from '../types';

const down = (u: number, v: number): ToolEvent => ({ type: 'pointer-down', point: { u, v }, button: 0 });
const key = (k: string): ToolEvent => ({ type: 'key', key: k });

/** Runs events the way the store does: finished edges come back through the context. */
function run(events: ToolEvent[], start: Point[][] = [], grabRadiusPx = 4) {
  let state: StraightEdgeState = straightEdgeTool.initial;
  let lines: Point[][] = start;
  const effects: ToolEffect[] = [];
  for (const e of events) {
    const ctx: ToolContext = { frameNumber: 0, activeTrackId: null, markOnFrame: null, grabRadiusPx, straightLines: lines };
    const r = straightEdgeTool.transition(state, e, ctx);
    state = r.state;
    for (const effect of r.effects) {
      effects.push(effect);
      if (effect.type === 'set-straight-lines') lines = effect.lines;
    }
  }
  return { state, lines, effects };
}

const rail = [down(20, 400), down(300, 420), down(600, 401)];

describe('straight-edge tool', () => {
  it('Enter ends an edge of three points and adds it to the draft', () => {
    const r = run([...rail, key('Enter')]);
    expect(r.lines).toEqual([[{ u: 20, v: 400 }, { u: 300, v: 420 }, { u: 600, v: 401 }]]);
    expect(r.state.points).toEqual([]);
  });

  it('a second press on the last point (a double-click) ends the edge too, without adding a point', () => {
    const r = run([...rail, down(601, 402)]);
    expect(r.lines).toHaveLength(1);
    expect(r.lines[0]).toHaveLength(3);
  });

  it('refuses to end an edge of fewer than three points, says why, and keeps the points', () => {
    const r = run([down(10, 10), down(200, 12), key('Enter')]);
    expect(r.effects).toEqual([]);
    expect(r.state.points).toHaveLength(2);
    expect(r.state.notice).toMatch(/at least 3 points/);
    // The third point clears the remark and the edge can end.
    const more = run([down(10, 10), down(200, 12), key('Enter'), down(400, 10), key('Enter')]);
    expect(more.lines).toHaveLength(1);
    expect(more.state.notice).toBeNull();
  });

  it('collects several edges', () => {
    const r = run([...rail, key('Enter'), down(40, 20), down(45, 240), down(40, 460), key('Enter')]);
    expect(r.lines).toHaveLength(2);
    expect(r.lines[1][1]).toEqual({ u: 45, v: 240 });
  });

  it('Backspace takes back the last point; from an empty edge it reopens the last finished edge without its last point', () => {
    const partial = run([down(10, 10), down(200, 12), key('Backspace')]);
    expect(partial.state.points).toEqual([{ u: 10, v: 10 }]);
    const reopened = run([...rail, key('Enter'), key('Backspace')]);
    expect(reopened.lines).toEqual([]);
    expect(reopened.state.points).toEqual([{ u: 20, v: 400 }, { u: 300, v: 420 }]);
    // Nothing to take back: nothing happens.
    expect(run([key('Backspace')]).effects).toEqual([]);
  });

  it('Delete clears every edge and the one being clicked', () => {
    const r = run([...rail, key('Enter'), down(5, 5), key('Delete')]);
    expect(r.lines).toEqual([]);
    expect(r.state.points).toEqual([]);
    expect(r.effects.at(-1)).toEqual({ type: 'set-straight-lines', lines: [] });
  });

  it('cancel (Escape) drops the edge being clicked and keeps the finished ones', () => {
    const r = run([...rail, key('Enter'), down(5, 5), down(50, 5), { type: 'cancel' }]);
    expect(r.lines).toHaveLength(1);
    expect(r.state.points).toEqual([]);
  });

  it('ignores right and middle presses', () => {
    const r = run([{ type: 'pointer-down', point: { u: 1, v: 1 }, button: 2 }, { type: 'pointer-down', point: { u: 9, v: 9 }, button: 1 }]);
    expect(r.state.points).toEqual([]);
  });

  it('stops at the body limit of points per edge and says so', () => {
    const events = Array.from({ length: MAX_EDGE_POINTS + 1 }, (_, i) => down(i * 10, 0));
    const r = run(events);
    expect(r.state.points).toHaveLength(MAX_EDGE_POINTS);
    expect(r.state.notice).toMatch(/at most 200 points/i);
  });

  it('follows the pointer for the rubber band', () => {
    const r = run([down(10, 10), { type: 'pointer-move', point: { u: 50, v: 60 } }]);
    expect(r.state.hover).toEqual({ u: 50, v: 60 });
  });
});
