import { describe, expect, it } from 'vitest';
import { rulerTool, type RulerState } from './ruler-tool';
import type { ToolContext, ToolEvent } from './tool-types';

const ctx: ToolContext = { frameNumber: 0, activeTrackId: null, markOnFrame: null, grabRadiusPx: 8 };
function run(events: ToolEvent[]) {
  let state: RulerState = rulerTool.initial;
  const effects = [];
  for (const e of events) {
    const r = rulerTool.transition(state, e, ctx);
    state = r.state;
    effects.push(...r.effects);
  }
  return { state, effects };
}

describe('ruler tool', () => {
  it('two ends then a length give the scale', () => {
    const r = run([
      { type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 },
      { type: 'pointer-move', point: { u: 50, v: 0 } },
      { type: 'pointer-down', point: { u: 300, v: 40 }, button: 0 },
      { type: 'submit', values: { lengthM: 2, toleranceM: 0.002 } },
    ]);
    expect(r.effects).toEqual([
      { type: 'open-dialog', dialog: 'scale-length' },
      { type: 'set-scale', scale: { p1: { u: 0, v: 0 }, p2: { u: 300, v: 40 }, lengthM: 2, lengthTolM: 0.002 } },
      { type: 'close-dialog' },
    ]);
    expect(r.state.phase).toBe('idle');
  });

  it('shows a rubber band to the cursor after the first end', () => {
    const r = run([{ type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 }, { type: 'pointer-move', point: { u: 9, v: 9 } }]);
    expect(r.state).toEqual({ phase: 'first-end', a: { u: 0, v: 0 }, hover: { u: 9, v: 9 } });
  });

  it('refuses a second end on top of the first', () => {
    const r = run([{ type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 }, { type: 'pointer-down', point: { u: 2, v: 2 }, button: 0 }]);
    expect(r.state.phase).toBe('first-end');
    expect(r.effects).toEqual([]);
  });

  it('keeps asking when the length is not positive', () => {
    const r = run([
      { type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 },
      { type: 'pointer-down', point: { u: 100, v: 0 }, button: 0 },
      { type: 'submit', values: { lengthM: 0, toleranceM: 0 } },
    ]);
    expect(r.state.phase).toBe('awaiting-length');
    expect(r.effects.map((e) => e.type)).toEqual(['open-dialog']);
  });

  it('cancel while typing closes the dialog and starts over', () => {
    const r = run([
      { type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 },
      { type: 'pointer-down', point: { u: 100, v: 0 }, button: 0 },
      { type: 'cancel' },
    ]);
    expect(r.state.phase).toBe('idle');
    expect(r.effects.at(-1)).toEqual({ type: 'close-dialog' });
  });
});
