import { describe, expect, it } from 'vitest';
import { createEditor, marksOfTrack, type MarkWrite } from './editor-store';

function loadedEditor(options: Parameters<typeof createEditor>[0] = {}, permissions = { canMark: true, canCalibrate: true }) {
  const editor = createEditor(options);
  const writes: MarkWrite[] = [];
  editor.onMarkWrite((w) => writes.push(w));
  editor.load({
    frames: Array.from({ length: 30 }, (_, i) => ({ frameNumber: i, tS: i / 240 })),
    tracks: [
      { id: 'ball', kind: 'projectile', label: 'Projectile' },
      { id: 'muzzle', kind: 'muzzle', label: 'Muzzle' },
    ],
    marks: [],
    calibration: null,
    permissions,
  });
  return { editor, writes };
}

describe('editor store', () => {
  it('starts on the first frame with the projectile track active', () => {
    const { editor } = loadedEditor();
    expect(editor.getState().frameNumber).toBe(0);
    expect(editor.getState().activeTrackId).toBe('ball');
  });

  it('a click with the place tool puts a mark and moves to the next frame', () => {
    const { editor, writes } = loadedEditor();
    editor.toolEvent({ type: 'pointer-down', point: { u: 100, v: 50 }, button: 0 });
    const s = editor.getState();
    expect(s.marksByTrack.ball[0]).toMatchObject({ uPx: 100, vPx: 50, snapped: false });
    expect(s.frameNumber).toBe(1);
    expect(writes).toEqual([{ trackId: 'ball', frameNumber: 0, mark: s.marksByTrack.ball[0], previous: null }]);
  });

  it('a marking click shows the next frame before it stores the mark (on the frame that was clicked)', () => {
    const { editor } = loadedEditor();
    const seen: { frameNumber: number; marked: boolean }[] = [];
    editor.subscribe(() => {
      const s = editor.getState();
      seen.push({ frameNumber: s.frameNumber, marked: !!s.marksByTrack.ball?.[0] });
    });
    editor.toolEvent({ type: 'pointer-down', point: { u: 100, v: 50 }, button: 0 });
    // The first change anyone hears of is the new frame, still without the mark.
    expect(seen.find((x) => x.frameNumber !== 0 || x.marked)).toEqual({ frameNumber: 1, marked: false });
    expect(seen.at(-1)).toEqual({ frameNumber: 1, marked: true });
    expect(editor.getState().marksByTrack.ball[1]).toBeUndefined();
  });

  it('uses the snapper and remembers that the mark was snapped', () => {
    const { editor } = loadedEditor({ snap: (_f, p) => ({ u: p.u + 0.4, v: p.v - 0.3 }) });
    editor.placeMark({ u: 10, v: 10 });
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 10.4, vPx: 9.7, placedUPx: 10, placedVPx: 10, snapped: true });
  });

  it('does not snap while snapping is switched off', () => {
    const { editor } = loadedEditor({ snap: (_f, p) => ({ u: p.u + 1, v: p.v }) });
    editor.setSnap(false);
    editor.placeMark({ u: 10, v: 10 });
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 10, vPx: 10, snapped: false });
  });

  it('keeps the click as placed when the snapper finds nothing', () => {
    const { editor } = loadedEditor({ snap: () => null });
    editor.placeMark({ u: 10, v: 10 });
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 10, vPx: 10, snapped: false });
  });

  it('undo removes a placed mark, returns to its frame and is saved; redo puts it back', () => {
    const { editor, writes } = loadedEditor();
    editor.placeMark({ u: 1, v: 2 });
    editor.step(1);
    editor.placeMark({ u: 3, v: 4 });
    editor.step(1);
    expect(editor.getState().frameNumber).toBe(2);

    editor.undo();
    expect(editor.getState().marksByTrack.ball[1]).toBeUndefined();
    expect(editor.getState().frameNumber).toBe(1);
    expect(writes.at(-1)).toMatchObject({ trackId: 'ball', frameNumber: 1, mark: null });

    editor.redo();
    expect(editor.getState().marksByTrack.ball[1]).toMatchObject({ uPx: 3, vPx: 4 });
    expect(writes.at(-1)?.mark).toMatchObject({ uPx: 3, vPx: 4 });
    expect(writes).toHaveLength(4);
  });

  it('a new edit after an undo clears the redo stack', () => {
    const { editor } = loadedEditor();
    editor.placeMark({ u: 1, v: 2 });
    editor.undo();
    editor.placeMark({ u: 5, v: 5 });
    editor.redo();
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 5, vPx: 5 });
    expect(editor.getState().history.redo).toHaveLength(0);
  });

  it('undo of a move restores the earlier position', () => {
    const { editor } = loadedEditor();
    editor.placeMark({ u: 1, v: 2 });
    editor.moveMark('ball', 0, { u: 7, v: 8 });
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 7, vPx: 8 });
    editor.undo();
    expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 1, vPx: 2 });
  });

  it('stepping clamps to the clip and Shift-size steps move by ten', () => {
    const { editor } = loadedEditor();
    editor.step(-1);
    expect(editor.getState().frameNumber).toBe(0);
    editor.step(10);
    expect(editor.getState().frameNumber).toBe(10);
    editor.step(100);
    expect(editor.getState().frameNumber).toBe(29);
  });

  it('steps over gaps in the frame list by index, not by number', () => {
    const editor = createEditor();
    editor.load({
      frames: [3, 4, 7, 9].map((n) => ({ frameNumber: n, tS: n / 100 })),
      tracks: [{ id: 't', kind: 'projectile', label: 'P' }],
      marks: [],
      calibration: null,
      permissions: { canMark: true, canCalibrate: false },
    });
    editor.step(1);
    editor.step(1);
    expect(editor.getState().frameNumber).toBe(7);
  });

  it('Home and End go to the first and last marked frame', () => {
    const { editor } = loadedEditor();
    editor.placeMark({ u: 1, v: 1 }, { frameNumber: 5 });
    editor.placeMark({ u: 1, v: 1 }, { frameNumber: 12 });
    editor.goToMarkedEnd('last');
    expect(editor.getState().frameNumber).toBe(12);
    editor.goToMarkedEnd('first');
    expect(editor.getState().frameNumber).toBe(5);
  });

  it('skip on an empty frame notes the skip and advances', () => {
    const { editor, writes } = loadedEditor();
    editor.skipFrame();
    const s = editor.getState();
    expect(s.skipped['ball@0']).toBe(true);
    expect(s.frameNumber).toBe(1);
    expect(writes).toEqual([]);
  });

  it('skip never deletes an existing mark silently: the first press asks, the second removes it', () => {
    const { editor, writes } = loadedEditor();
    editor.placeMark({ u: 1, v: 1 });
    editor.goToFrame(0);
    writes.length = 0;
    editor.skipFrame();
    let s = editor.getState();
    expect(s.marksByTrack.ball[0]).toMatchObject({ uPx: 1, vPx: 1 });
    expect(s.skipNeedsConfirm).toBe('ball@0');
    expect(s.frameNumber).toBe(0);
    expect(writes).toEqual([]);
    editor.skipFrame();
    s = editor.getState();
    expect(s.marksByTrack.ball[0]).toBeUndefined();
    expect(s.skipped['ball@0']).toBe(true);
    expect(s.skipNeedsConfirm).toBeNull();
    expect(s.frameNumber).toBe(1);
    expect(writes).toHaveLength(1);
  });

  it('a skip waiting for confirmation is forgotten on cancel or when the frame changes', () => {
    const { editor } = loadedEditor();
    editor.placeMark({ u: 1, v: 1 });
    editor.goToFrame(0);
    editor.skipFrame();
    editor.cancelSkip();
    expect(editor.getState().skipNeedsConfirm).toBeNull();
    editor.skipFrame();
    editor.step(1);
    editor.step(-1);
    editor.skipFrame();
    // Asked again rather than taking the earlier press as the confirmation.
    expect(editor.getState().marksByTrack.ball[0]).toBeDefined();
    editor.skipFrame({ removeMark: true });
    expect(editor.getState().marksByTrack.ball[0]).toBeUndefined();
  });

  it('people who may not mark change nothing and get no marking tool', () => {
    const { editor, writes } = loadedEditor({}, { canMark: false, canCalibrate: false });
    expect(editor.getState().activeTool).toBe('hand');
    editor.setTool('place');
    editor.placeMark({ u: 1, v: 1 });
    editor.toolEvent({ type: 'pointer-down', point: { u: 1, v: 1 }, button: 0 });
    expect(marksOfTrack(editor.getState(), 'ball')).toHaveLength(0);
    expect(writes).toHaveLength(0);
  });

  it('a tracker cannot pick calibration tools', () => {
    const { editor } = loadedEditor({}, { canMark: true, canCalibrate: false });
    editor.setTool('ruler');
    expect(editor.getState().activeTool).toBe('place');
  });

  it('scale set through the ruler tool is undoable', () => {
    const { editor } = loadedEditor();
    editor.setTool('ruler');
    editor.toolEvent({ type: 'pointer-down', point: { u: 10, v: 10 }, button: 0 });
    editor.toolEvent({ type: 'pointer-down', point: { u: 210, v: 10 }, button: 0 });
    expect(editor.getState().dialog).toBe('scale-length');
    editor.toolEvent({ type: 'submit', values: { lengthM: 1, toleranceM: 0.001 } });
    expect(editor.getState().calibrationDraft.scale).toEqual({ p1: { u: 10, v: 10 }, p2: { u: 210, v: 10 }, lengthM: 1, lengthTolM: 0.001 });
    expect(editor.getState().dialog).toBeNull();
    editor.undo();
    expect(editor.getState().calibrationDraft.scale).toBeNull();
  });

  it('straight edges clicked with the straight-edge tool go into the draft, survive a tool switch and undo edge by edge', () => {
    const { editor } = loadedEditor();
    editor.setTool('straight-edge');
    const edge = (v: number) => {
      for (const u of [20, 300, 600]) editor.toolEvent({ type: 'pointer-down', point: { u, v: v + (u === 300 ? 8 : 0) }, button: 0 });
      editor.toolEvent({ type: 'key', key: 'Enter' });
    };
    edge(40);
    edge(440);
    expect(editor.getState().calibrationDraft.straightLines).toHaveLength(2);
    editor.setTool('place');
    editor.setTool('straight-edge');
    expect(editor.getState().calibrationDraft.straightLines[1]).toEqual([{ u: 20, v: 440 }, { u: 300, v: 448 }, { u: 600, v: 440 }]);
    editor.undo();
    expect(editor.getState().calibrationDraft.straightLines).toHaveLength(1);
  });

  it('the corrected-grid overlay is a view switch, outside history', () => {
    const { editor } = loadedEditor({}, { canMark: false, canCalibrate: false });
    expect(editor.getState().lensGridOn).toBe(false);
    editor.setLensGrid(true);
    expect(editor.getState().lensGridOn).toBe(true);
    expect(editor.getState().history.undo).toHaveLength(0);
  });

  it('a server correction is shown without entering history or the write channel', () => {
    const { editor, writes } = loadedEditor();
    editor.placeMark({ u: 1, v: 1 });
    editor.applyServerMark('ball', 0, { trackId: 'ball', frameNumber: 0, uPx: 9, vPx: 9, placedUPx: 8, placedVPx: 8, snapped: true });
    expect(editor.getState().marksByTrack.ball[0].uPx).toBe(9);
    expect(writes).toHaveLength(1);
    expect(editor.getState().history.undo).toHaveLength(1);
  });

  it('notifies subscribers on change and stops after unsubscribing', () => {
    const { editor } = loadedEditor();
    let calls = 0;
    const off = editor.subscribe(() => calls++);
    editor.step(1);
    off();
    editor.step(1);
    expect(calls).toBe(1);
  });
  // Escape reaches the store as a cancel event (use-workspace-keys), never as a key.
  describe('cancel (Escape)', () => {
    it('drops a half-drawn scale reference: no dialog, no scale, nothing in history', () => {
      const { editor } = loadedEditor();
      editor.setTool('ruler');
      editor.toolEvent({ type: 'pointer-down', point: { u: 10, v: 10 }, button: 0 });
      editor.toolEvent({ type: 'cancel' });
      expect(editor.getState().toolStates.ruler).toEqual({ phase: 'idle' });
      expect(editor.getState().dialog).toBeNull();
      editor.toolEvent({ type: 'pointer-down', point: { u: 210, v: 10 }, button: 0 });
      expect(editor.getState().calibrationDraft.scale).toBeNull();
      expect(editor.getState().history.undo).toHaveLength(0);
    });

    it('closes the length dialog the ruler opened and starts over', () => {
      const { editor } = loadedEditor();
      editor.setTool('ruler');
      editor.toolEvent({ type: 'pointer-down', point: { u: 10, v: 10 }, button: 0 });
      editor.toolEvent({ type: 'pointer-down', point: { u: 210, v: 10 }, button: 0 });
      expect(editor.getState().dialog).toBe('scale-length');
      editor.toolEvent({ type: 'cancel' });
      expect(editor.getState().dialog).toBeNull();
      expect(editor.getState().toolStates.ruler).toEqual({ phase: 'idle' });
      expect(editor.getState().calibrationDraft.scale).toBeNull();
    });

    it('closes the angle dialog of the horizon tool without setting a level', () => {
      const { editor } = loadedEditor();
      editor.setTool('horizon');
      editor.toolEvent({ type: 'key', key: 'a' });
      expect(editor.getState().dialog).toBe('level-angle');
      editor.toolEvent({ type: 'cancel' });
      expect(editor.getState().dialog).toBeNull();
      expect(editor.getState().calibrationDraft.level).toBeNull();
    });

    it('forgets the plane corners clicked so far', () => {
      const { editor } = loadedEditor();
      editor.setTool('plane-fix');
      editor.toolEvent({ type: 'pointer-down', point: { u: 0, v: 0 }, button: 0 });
      editor.toolEvent({ type: 'pointer-down', point: { u: 100, v: 0 }, button: 0 });
      editor.toolEvent({ type: 'cancel' });
      expect(editor.getState().toolStates['plane-fix']).toMatchObject({ phase: 'collecting', corners: [] });
    });

    it('ends a mark drag without moving the mark or writing', () => {
      const { editor, writes } = loadedEditor();
      editor.placeMark({ u: 50, v: 50 });
      editor.goToFrame(0);
      editor.toolEvent({ type: 'pointer-down', point: { u: 50, v: 50 }, button: 0 });
      editor.toolEvent({ type: 'pointer-move', point: { u: 80, v: 80 } });
      editor.toolEvent({ type: 'cancel' });
      editor.toolEvent({ type: 'pointer-up', point: { u: 80, v: 80 } });
      expect(editor.getState().marksByTrack.ball[0]).toMatchObject({ uPx: 50, vPx: 50 });
      expect(writes).toHaveLength(1);
    });
  });

  it('a reader (no marking, no calibrating) gets the hand tool and changes nothing', () => {
    const { editor, writes } = loadedEditor({}, { canMark: false, canCalibrate: false });
    expect(editor.getState().activeTool).toBe('hand');
    editor.setTool('place');
    editor.setTool('ruler');
    expect(editor.getState().activeTool).toBe('hand');
    editor.toolEvent({ type: 'pointer-down', point: { u: 1, v: 1 }, button: 0 });
    editor.placeMark({ u: 1, v: 1 });
    editor.setCalibration({ origin: { u: 1, v: 1 } });
    expect(marksOfTrack(editor.getState(), 'ball')).toHaveLength(0);
    expect(editor.getState().calibrationDraft.origin).toBeNull();
    expect(writes).toHaveLength(0);
  });
});
