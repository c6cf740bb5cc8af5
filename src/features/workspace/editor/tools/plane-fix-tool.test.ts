import { describe, expect, it } from 'vitest';
import { planeFixTool, type PlaneFixState } from './plane-fix-tool';
import type { ToolEvent } from './tool-types';

const ctx = { frameNumber: 0, activeTrackId: null, markOnFrame: null, grabRadiusPx: 8 };
function run(events: ToolEvent[]) {
  let state: PlaneFixState = planeFixTool.initial;
  const effects = [];
  for (const e of events) {
    const r = planeFixTool.transition(state, e, ctx);
    state = r.state;
    effects.push(...r.effects);
  }
  return { state, effects };
}
const corner = (u: number, v: number): ToolEvent => ({ type: 'pointer-down', point: { u, v }, button: 0 });

describe('plane fix tool', () => {
  it('four corners then a size give the plane', () => {
    const r = run([corner(0, 0), corner(100, 0), corner(100, 80), corner(0, 80), { type: 'submit', values: { widthM: 2, heightM: 1.6 } }]);
    expect(r.effects).toEqual([
      { type: 'open-dialog', dialog: 'plane-size' },
      {
        type: 'set-plane',
        plane: { corners: [{ u: 0, v: 0 }, { u: 100, v: 0 }, { u: 100, v: 80 }, { u: 0, v: 80 }], widthM: 2, heightM: 1.6 },
      },
      { type: 'close-dialog' },
    ]);
    expect(r.state).toEqual(planeFixTool.initial);
  });

  it('Backspace takes back the last corner', () => {
    const r = run([corner(0, 0), corner(100, 0), { type: 'key', key: 'Backspace' }]);
    expect(r.state).toMatchObject({ phase: 'collecting', corners: [{ u: 0, v: 0 }] });
  });

  it('ignores a corner on top of another', () => {
    const r = run([corner(0, 0), corner(1, 1)]);
    expect(r.state).toMatchObject({ corners: [{ u: 0, v: 0 }] });
  });

  it('a zero size is refused', () => {
    const r = run([corner(0, 0), corner(100, 0), corner(100, 80), corner(0, 80), { type: 'submit', values: { widthM: 0, heightM: 1 } }]);
    expect(r.state.phase).toBe('awaiting-size');
  });
});
