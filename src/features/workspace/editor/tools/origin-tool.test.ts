import { describe, expect, it } from 'vitest';
import { originTool } from './origin-tool';

const ctx = { frameNumber: 0, activeTrackId: null, markOnFrame: null, grabRadiusPx: 8 };

describe('origin pin tool', () => {
  it('one left click sets the origin there', () => {
    const r = originTool.transition(originTool.initial, { type: 'pointer-down', point: { u: 12.5, v: 400 }, button: 0 }, ctx);
    expect(r.effects).toEqual([{ type: 'set-origin', origin: { u: 12.5, v: 400 } }]);
  });
  it('ignores other buttons and moves', () => {
    expect(originTool.transition(originTool.initial, { type: 'pointer-down', point: { u: 1, v: 1 }, button: 1 }, ctx).effects).toEqual([]);
    expect(originTool.transition(originTool.initial, { type: 'pointer-move', point: { u: 1, v: 1 } }, ctx).effects).toEqual([]);
  });
});
