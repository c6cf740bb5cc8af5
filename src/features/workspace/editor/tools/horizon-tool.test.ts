import { describe, expect, it } from 'vitest';
import { horizonTool, type HorizonState } from './horizon-tool';
import type { ToolEvent } from './tool-types';

const ctx = { frameNumber: 0, activeTrackId: null, markOnFrame: null, grabRadiusPx: 8 };
function run(events: ToolEvent[]) {
  let state: HorizonState = horizonTool.initial;
  const effects = [];
  for (const e of events) {
    const r = horizonTool.transition(state, e, ctx);
    state = r.state;
    effects.push(...r.effects);
  }
  return { state, effects };
}

describe('horizon tool', () => {
  it('two points give a level line', () => {
    const r = run([
      { type: 'pointer-down', point: { u: 0, v: 100 }, button: 0 },
      { type: 'pointer-down', point: { u: 400, v: 104 }, button: 0 },
    ]);
    expect(r.effects).toEqual([{ type: 'set-level', level: { kind: 'line', p1: { u: 0, v: 100 }, p2: { u: 400, v: 104 } } }]);
    expect(r.state.phase).toBe('idle');
  });

  it('"A" opens the angle dialog and a typed angle sets the roll', () => {
    const r = run([{ type: 'key', key: 'a' }, { type: 'submit', values: { angleDeg: -1.5 } }]);
    expect(r.effects).toEqual([
      { type: 'open-dialog', dialog: 'level-angle' },
      { type: 'set-level', level: { kind: 'angle', rollDeg: -1.5 } },
      { type: 'close-dialog' },
    ]);
  });

  it('refuses an implausible roll of 45 degrees or more', () => {
    const r = run([{ type: 'key', key: 'a' }, { type: 'submit', values: { angleDeg: 50 } }]);
    expect(r.state.phase).toBe('typing-angle');
  });

  // The workspace turns the Escape key into a cancel event before any tool sees it.
  it('cancel (Escape) after the first point starts over', () => {
    const r = run([{ type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 }, { type: 'cancel' }]);
    expect(r.state.phase).toBe('idle');
  });
});
