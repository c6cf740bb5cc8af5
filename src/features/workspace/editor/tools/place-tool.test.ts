import { describe, expect, it } from 'vitest';
import { placeTool, type PlaceState } from './place-tool';
import type { ToolContext } from './tool-types';

const ctx = (over: Partial<ToolContext> = {}): ToolContext => ({
  frameNumber: 4,
  activeTrackId: 't',
  markOnFrame: null,
  grabRadiusPx: 8,
  ...over,
});
const mark = { trackId: 't', frameNumber: 4, uPx: 100, vPx: 100, placedUPx: 101, placedVPx: 99, snapped: true };

describe('place tool', () => {
  it('a click on empty image places a mark and steps one frame on', () => {
    const r = placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 5, v: 6 }, button: 0 }, ctx());
    expect(r.effects).toEqual([{ type: 'place-mark', point: { u: 5, v: 6 } }, { type: 'step', by: 1 }]);
    expect(r.state.phase).toBe('idle');
  });

  it('ignores other buttons and a missing track', () => {
    expect(placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 5, v: 6 }, button: 2 }, ctx()).effects).toEqual([]);
    expect(placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 5, v: 6 }, button: 0 }, ctx({ activeTrackId: null })).effects).toEqual([]);
  });

  it('a press on the existing mark starts a drag that ends in one move', () => {
    let s: PlaceState = placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 103, v: 98 }, button: 0 }, ctx({ markOnFrame: mark })).state;
    expect(s.phase).toBe('dragging');
    s = placeTool.transition(s, { type: 'pointer-move', point: { u: 110, v: 90 } }, ctx({ markOnFrame: mark })).state;
    const r = placeTool.transition(s, { type: 'pointer-up', point: { u: 111, v: 91 } }, ctx({ markOnFrame: mark }));
    expect(r.effects).toEqual([{ type: 'move-mark', trackId: 't', frameNumber: 4, to: { u: 111, v: 91 } }]);
    expect(r.state.phase).toBe('idle');
  });

  it('a press on the mark without moving changes nothing', () => {
    const down = placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 100, v: 100 }, button: 0 }, ctx({ markOnFrame: mark }));
    const up = placeTool.transition(down.state, { type: 'pointer-up', point: { u: 100.1, v: 100 } }, ctx({ markOnFrame: mark }));
    expect([...down.effects, ...up.effects]).toEqual([]);
  });

  it('a press just outside the grab radius places a new mark instead', () => {
    const r = placeTool.transition(placeTool.initial, { type: 'pointer-down', point: { u: 109, v: 100 }, button: 0 }, ctx({ markOnFrame: mark }));
    expect(r.effects[0]).toEqual({ type: 'place-mark', point: { u: 109, v: 100 } });
  });

  it('Delete removes the mark on this frame, and does nothing without one', () => {
    expect(placeTool.transition(placeTool.initial, { type: 'key', key: 'Delete' }, ctx({ markOnFrame: mark })).effects).toEqual([
      { type: 'delete-mark', trackId: 't', frameNumber: 4 },
    ]);
    expect(placeTool.transition(placeTool.initial, { type: 'key', key: 'Delete' }, ctx()).effects).toEqual([]);
  });
});
