// The workspace's one editor API. Plain TypeScript (no React): React reads it
// through useSyncExternalStore and react-konva only renders what it holds.
// Every mark change (a fresh edit, an undo or a redo) is reported on the
// write channel, which the page turns into saves to the server.
import { EMPTY_HISTORY, invert, pushCommand, type EditorCommand, type History } from './history';
import { horizonTool, type HorizonState } from './tools/horizon-tool';
import { originTool, type OriginState } from './tools/origin-tool';
import { placeTool, type PlaceState } from './tools/place-tool';
import { planeFixTool, type PlaneFixState } from './tools/plane-fix-tool';
import { rulerTool, type RulerState } from './tools/ruler-tool';
import { straightEdgeTool, type StraightEdgeState } from './tools/straight-edge-tool';
import type { Tool, ToolContext, ToolDialog, ToolEffect, ToolEvent } from './tools/tool-types';
import {
  EMPTY_CALIBRATION,
  markKey,
  type CalibrationDraft,
  type EditorMark,
  type EditorTrack,
  type FrameInfo,
  type MarkKey,
  type Point,
  type ToolId,
  type ViewTransform,
} from './types';

export interface ToolStates {
  place: PlaceState;
  ruler: RulerState;
  'origin-pin': OriginState;
  horizon: HorizonState;
  'plane-fix': PlaneFixState;
  'straight-edge': StraightEdgeState;
  hand: null;
}

export interface EditorPermissions {
  canMark: boolean;
  canCalibrate: boolean;
}

export interface EditorState {
  frames: FrameInfo[];
  frameNumber: number;
  view: ViewTransform;
  activeTool: ToolId;
  toolStates: ToolStates;
  dialog: ToolDialog | null;
  tracks: EditorTrack[];
  activeTrackId: string | null;
  marksByTrack: Record<string, Record<number, EditorMark>>;
  /** Frames the tracker passed on purpose (projectile hidden), per track; local to this session. */
  skipped: Record<MarkKey, true>;
  /**
   * Skip was pressed on a frame that has a mark: the mark stays until the person presses skip
   * again on that frame (or confirms in the notice); any other move forgets the request.
   */
  skipNeedsConfirm: MarkKey | null;
  calibrationDraft: CalibrationDraft;
  history: History;
  permissions: EditorPermissions;
  /** Refine clicks to the projectile's centroid (on by default). */
  snapOn: boolean;
  /** Draw a grid of world-straight lines through the lens model, and the clicked straight edges, on the frame. */
  lensGridOn: boolean;
}

export interface MarkWrite {
  trackId: string;
  frameNumber: number;
  /** Null: the mark was removed. */
  mark: EditorMark | null;
  /** What the store showed before this change, for rolling back a failed save. */
  previous: EditorMark | null;
}

/** Refines a click to the projectile's centre; returns null when there is nothing to snap to. */
export type Snapper = (frameNumber: number, point: Point) => Point | null;

export interface EditorOptions {
  snap?: Snapper;
}

const TOOLS: { [K in Exclude<ToolId, 'hand'>]: Tool<ToolStates[K]> } = {
  place: placeTool,
  ruler: rulerTool,
  'origin-pin': originTool,
  horizon: horizonTool,
  'plane-fix': planeFixTool,
  'straight-edge': straightEdgeTool,
};

const CALIBRATION_TOOLS: ToolId[] = ['ruler', 'origin-pin', 'horizon', 'plane-fix', 'straight-edge'];

/** Grab radius for dragging a mark: 8 screen pixels, whatever the zoom. */
const GRAB_RADIUS_SCREEN_PX = 8;

export function initialToolStates(): ToolStates {
  return {
    place: placeTool.initial,
    ruler: rulerTool.initial,
    'origin-pin': originTool.initial,
    horizon: horizonTool.initial,
    'plane-fix': planeFixTool.initial,
    'straight-edge': straightEdgeTool.initial,
    hand: null,
  };
}

export function initialEditorState(): EditorState {
  return {
    frames: [],
    frameNumber: 0,
    view: { zoom: 1, panX: 0, panY: 0 },
    activeTool: 'place',
    toolStates: initialToolStates(),
    dialog: null,
    tracks: [],
    activeTrackId: null,
    marksByTrack: {},
    skipped: {},
    skipNeedsConfirm: null,
    calibrationDraft: EMPTY_CALIBRATION,
    history: EMPTY_HISTORY,
    permissions: { canMark: false, canCalibrate: false },
    snapOn: true,
    lensGridOn: false,
  };
}

export interface EditorLoad {
  frames: FrameInfo[];
  tracks: EditorTrack[];
  marks: EditorMark[];
  calibration: CalibrationDraft | null;
  permissions: EditorPermissions;
  frameNumber?: number;
}

export type Editor = ReturnType<typeof createEditor>;

export function createEditor(options: EditorOptions = {}) {
  let state = initialEditorState();
  const listeners = new Set<() => void>();
  const writers = new Set<(write: MarkWrite) => void>();

  const set = (next: EditorState) => {
    if (next === state) return;
    state = next;
    for (const l of listeners) l();
  };

  const markAt = (s: EditorState, trackId: string | null, frameNumber: number): EditorMark | null =>
    (trackId && s.marksByTrack[trackId]?.[frameNumber]) || null;

  /** Puts a mark (or removes it, with null) without touching history or the write channel. */
  const withMark = (s: EditorState, trackId: string, frameNumber: number, mark: EditorMark | null): EditorState => {
    const track = { ...(s.marksByTrack[trackId] ?? {}) };
    if (mark) track[frameNumber] = mark;
    else delete track[frameNumber];
    return { ...s, marksByTrack: { ...s.marksByTrack, [trackId]: track } };
  };

  const emitWrite = (write: MarkWrite) => {
    for (const w of writers) w(write);
  };

  /** Applies one command's "after" side, emitting a write for marks. */
  const applyCommand = (s: EditorState, command: EditorCommand): EditorState => {
    if (command.kind === 'calibration') return { ...s, calibrationDraft: command.after };
    const previous = markAt(s, command.trackId, command.frameNumber);
    const next = withMark(s, command.trackId, command.frameNumber, command.after);
    emitWrite({ trackId: command.trackId, frameNumber: command.frameNumber, mark: command.after, previous });
    return next;
  };

  const commit = (command: EditorCommand, extra: (s: EditorState) => EditorState = (s) => s) => {
    const applied = applyCommand(state, command);
    set(extra({ ...applied, history: pushCommand(state.history, command) }));
  };

  /** Applies an undo or redo step; a mark step shows the frame it happened on. */
  const replay = (step: EditorCommand, command: EditorCommand, history: History) => {
    const applied = applyCommand(state, step);
    set({ ...applied, frameNumber: command.kind === 'mark' ? command.frameNumber : applied.frameNumber, history });
  };

  const indexOfFrame = (frameNumber: number) => {
    const frames = state.frames;
    let lo = 0;
    let hi = frames.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (frames[mid].frameNumber < frameNumber) lo = mid + 1;
      else hi = mid - 1;
    }
    return Math.min(lo, frames.length - 1);
  };

  const frameAfterStep = (by: number) => {
    if (state.frames.length === 0) return state.frameNumber;
    const i = Math.max(0, Math.min(state.frames.length - 1, indexOfFrame(state.frameNumber) + by));
    return state.frames[i].frameNumber;
  };

  const toolContext = (): ToolContext => ({
    frameNumber: state.frameNumber,
    activeTrackId: state.activeTrackId,
    markOnFrame: markAt(state, state.activeTrackId, state.frameNumber),
    grabRadiusPx: GRAB_RADIUS_SCREEN_PX / state.view.zoom,
    straightLines: state.calibrationDraft.straightLines,
  });

  const runEffects = (effects: ToolEffect[]) => {
    // A click that marks and steps on shows the next frame first (the person's
    // eyes are already there), then stores the mark on the frame it was placed on.
    const clickFrame = state.frameNumber;
    const marksAndSteps = effects.some((e) => e.type === 'place-mark') && effects.some((e) => e.type === 'step');
    const ordered = marksAndSteps ? [...effects.filter((e) => e.type === 'step'), ...effects.filter((e) => e.type !== 'step')] : effects;
    for (const effect of ordered) {
      switch (effect.type) {
        case 'place-mark':
          editor.placeMark(effect.point, { frameNumber: clickFrame });
          break;
        case 'move-mark':
          editor.moveMark(effect.trackId, effect.frameNumber, effect.to);
          break;
        case 'delete-mark':
          editor.deleteMark(effect.trackId, effect.frameNumber);
          break;
        case 'step':
          editor.step(effect.by);
          break;
        case 'open-dialog':
          editor.setDialog(effect.dialog);
          break;
        case 'close-dialog':
          editor.setDialog(null);
          break;
        case 'set-scale':
          editor.setCalibration({ scale: effect.scale });
          break;
        case 'set-origin':
          editor.setCalibration({ origin: effect.origin });
          break;
        case 'set-level':
          editor.setCalibration({ level: effect.level });
          break;
        case 'set-plane':
          editor.setCalibration({ plane: effect.plane });
          break;
        case 'set-straight-lines':
          editor.setCalibration({ straightLines: effect.lines });
          break;
      }
    }
  };

  const editor = {
    getState: () => state,
    subscribe(listener: () => void): () => void {
      listeners.add(listener);
      return () => {
        listeners.delete(listener);
      };
    },
    /** Listen to every mark change the person makes (edit, undo, redo) to save it. */
    onMarkWrite(writer: (write: MarkWrite) => void): () => void {
      writers.add(writer);
      return () => {
        writers.delete(writer);
      };
    },

    load(data: EditorLoad) {
      const marksByTrack: EditorState['marksByTrack'] = {};
      for (const t of data.tracks) marksByTrack[t.id] = {};
      for (const m of data.marks) (marksByTrack[m.trackId] ??= {})[m.frameNumber] = m;
      const activeTrackId = state.activeTrackId && data.tracks.some((t) => t.id === state.activeTrackId)
        ? state.activeTrackId
        : (data.tracks.find((t) => t.kind === 'projectile') ?? data.tracks[0])?.id ?? null;
      const frameNumber = data.frameNumber ?? (data.frames.some((f) => f.frameNumber === state.frameNumber) ? state.frameNumber : data.frames[0]?.frameNumber ?? 0);
      const activeTool = toolAllowed(data.permissions, state.activeTool) ? state.activeTool : data.permissions.canMark ? 'place' : 'hand';
      set({
        ...state,
        frames: data.frames,
        frameNumber,
        tracks: data.tracks,
        activeTrackId,
        marksByTrack,
        calibrationDraft: data.calibration ?? EMPTY_CALIBRATION,
        permissions: data.permissions,
        activeTool,
        history: EMPTY_HISTORY,
      });
    },

    setTracks(tracks: EditorTrack[]) {
      const marksByTrack = { ...state.marksByTrack };
      for (const t of tracks) marksByTrack[t.id] ??= {};
      const activeTrackId = state.activeTrackId ?? tracks[0]?.id ?? null;
      set({ ...state, tracks, marksByTrack, activeTrackId });
    },

    setActiveTrack(trackId: string) {
      if (state.tracks.some((t) => t.id === trackId)) set({ ...state, activeTrackId: trackId });
    },

    setTool(tool: ToolId) {
      if (!toolAllowed(state.permissions, tool) || tool === state.activeTool) return;
      set({ ...state, activeTool: tool, toolStates: initialToolStates(), dialog: null });
    },

    setSnap(on: boolean) {
      if (on !== state.snapOn) set({ ...state, snapOn: on });
    },

    setLensGrid(on: boolean) {
      if (on !== state.lensGridOn) set({ ...state, lensGridOn: on });
    },

    setView(view: ViewTransform) {
      set({ ...state, view });
    },

    /** Feed a pointer, key or dialog event to the active tool. */
    toolEvent(event: ToolEvent) {
      const id = state.activeTool;
      // load() and setTool() only ever make an allowed tool active.
      if (id === 'hand') return;
      const tool = TOOLS[id] as Tool<unknown>;
      const result = tool.transition(state.toolStates[id], event, toolContext());
      if (result.state !== state.toolStates[id]) set({ ...state, toolStates: { ...state.toolStates, [id]: result.state } });
      runEffects(result.effects);
    },

    placeMark(point: Point, at: { trackId?: string; frameNumber?: number } = {}) {
      const trackId = at.trackId ?? state.activeTrackId;
      const frameNumber = at.frameNumber ?? state.frameNumber;
      if (!trackId || !state.permissions.canMark) return;
      const snappedTo = state.snapOn ? (options.snap?.(frameNumber, point) ?? null) : null;
      const p = snappedTo ?? point;
      const after: EditorMark = { trackId, frameNumber, uPx: p.u, vPx: p.v, placedUPx: point.u, placedVPx: point.v, snapped: snappedTo !== null };
      const before = markAt(state, trackId, frameNumber);
      const skipped = { ...state.skipped };
      delete skipped[markKey(trackId, frameNumber)];
      commit({ kind: 'mark', trackId, frameNumber, before, after }, (s) => ({ ...s, skipped }));
    },

    /** A dragged mark keeps the position the person chose: no snap, and it counts as placed. */
    moveMark(trackId: string, frameNumber: number, to: Point) {
      const before = markAt(state, trackId, frameNumber);
      if (!before || !state.permissions.canMark) return;
      // Moved (or accepted where it is) by a person: the mark is theirs now, as the server will record it.
      const after: EditorMark = { ...before, uPx: to.u, vPx: to.v, placedUPx: to.u, placedVPx: to.v, snapped: false, source: 'hand', confidence: null, lowConfidenceReason: null };
      commit({ kind: 'mark', trackId, frameNumber, before, after });
    },

    deleteMark(trackId: string, frameNumber: number) {
      const before = markAt(state, trackId, frameNumber);
      if (!before || !state.permissions.canMark) return;
      commit({ kind: 'mark', trackId, frameNumber, before, after: null });
    },

    /**
     * The projectile cannot be seen on this frame: note the skip and go on. A mark already on the
     * frame is never dropped silently: the first press only asks (skipNeedsConfirm), a second press
     * on the same frame, or `{ removeMark: true }` from the notice's button, removes it (undoable).
     */
    skipFrame({ removeMark = false }: { removeMark?: boolean } = {}) {
      const trackId = state.activeTrackId;
      if (!trackId || !state.permissions.canMark) return;
      const frameNumber = state.frameNumber;
      const key = markKey(trackId, frameNumber);
      if (markAt(state, trackId, frameNumber)) {
        if (!removeMark && state.skipNeedsConfirm !== key) {
          set({ ...state, skipNeedsConfirm: key });
          return;
        }
        editor.deleteMark(trackId, frameNumber);
      }
      set({ ...state, skipNeedsConfirm: null, skipped: { ...state.skipped, [key]: true } });
      editor.step(1);
    },

    /** Keep the mark after all: forget a skip that was waiting for confirmation. */
    cancelSkip() {
      if (state.skipNeedsConfirm !== null) set({ ...state, skipNeedsConfirm: null });
    },

    step(by: number) {
      const frameNumber = frameAfterStep(by);
      if (frameNumber !== state.frameNumber) set({ ...state, frameNumber, skipNeedsConfirm: null });
    },

    goToFrame(frameNumber: number) {
      if (state.frames.length === 0) return;
      const target = state.frames[indexOfFrame(frameNumber)].frameNumber;
      if (target !== state.frameNumber) set({ ...state, frameNumber: target, skipNeedsConfirm: null });
    },

    /** Home / End: the first or last frame the active track has a mark on. */
    goToMarkedEnd(which: 'first' | 'last') {
      const marks = state.activeTrackId ? state.marksByTrack[state.activeTrackId] : undefined;
      const numbers = marks ? Object.keys(marks).map(Number) : [];
      if (numbers.length === 0) return;
      editor.goToFrame(which === 'first' ? Math.min(...numbers) : Math.max(...numbers));
    },

    setCalibration(patch: Partial<CalibrationDraft>) {
      if (!state.permissions.canCalibrate) return;
      commit({ kind: 'calibration', before: state.calibrationDraft, after: { ...state.calibrationDraft, ...patch } });
    },

    /** The calibration as saved on the server (after saving a version): shown as is, outside history. */
    replaceCalibration(draft: CalibrationDraft) {
      set({ ...state, calibrationDraft: draft });
    },

    /** Undo the last change; the view goes to the frame it happened on. */
    undo() {
      const command = state.history.undo.at(-1);
      if (!command) return;
      replay(invert(command), command, { undo: state.history.undo.slice(0, -1), redo: [...state.history.redo, command] });
    },

    redo() {
      const command = state.history.redo.at(-1);
      if (!command) return;
      replay(command, command, { undo: [...state.history.undo, command], redo: state.history.redo.slice(0, -1) });
    },

    /**
     * The server's word on one mark (after a failed save, or when someone else
     * changed it): shown as is, without history or a new write.
     */
    applyServerMark(trackId: string, frameNumber: number, mark: EditorMark | null) {
      set(withMark(state, trackId, frameNumber, mark));
    },

    /** After a file import: the track's marks are what the server now holds; old undo steps on it no longer apply. */
    replaceTrackMarks(trackId: string, marks: EditorMark[]) {
      const track: Record<number, EditorMark> = {};
      for (const m of marks) track[m.frameNumber] = m;
      const keep = (c: EditorCommand) => c.kind !== 'mark' || c.trackId !== trackId;
      set({
        ...state,
        marksByTrack: { ...state.marksByTrack, [trackId]: track },
        history: { undo: state.history.undo.filter(keep), redo: state.history.redo.filter(keep) },
      });
    },

    setDialog(dialog: ToolDialog | null) {
      set({ ...state, dialog });
    },
  };
  return editor;
}

/** Who may use which tool: calibration tools need canCalibrate, the place tool canMark; anyone may pan. */
function toolAllowed(p: EditorPermissions, tool: ToolId) {
  return tool === 'hand' || (CALIBRATION_TOOLS.includes(tool) ? p.canCalibrate : p.canMark);
}

export function marksOfTrack(state: EditorState, trackId: string | null): EditorMark[] {
  if (!trackId) return [];
  return Object.values(state.marksByTrack[trackId] ?? {}).sort((a, b) => a.frameNumber - b.frameNumber);
}
