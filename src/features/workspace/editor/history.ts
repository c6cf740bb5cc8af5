// Undo and redo keep commands as data (what was there before and after), so
// undoing is applying "before" and redoing is applying "after" again. Each
// change goes through the same write channel as a fresh edit, so an undo is
// saved to the server like any other edit.
import type { CalibrationDraft, EditorMark } from './types';

export type EditorCommand =
  | { kind: 'mark'; trackId: string; frameNumber: number; before: EditorMark | null; after: EditorMark | null }
  | { kind: 'calibration'; before: CalibrationDraft; after: CalibrationDraft };

export interface History {
  undo: EditorCommand[];
  redo: EditorCommand[];
}

export const EMPTY_HISTORY: History = { undo: [], redo: [] };

/** Enough for a long session; older steps drop off so memory stays bounded. */
export const HISTORY_LIMIT = 500;

export function pushCommand(history: History, command: EditorCommand): History {
  const undo = [...history.undo, command];
  if (undo.length > HISTORY_LIMIT) undo.shift();
  return { undo, redo: [] };
}

export function invert(command: EditorCommand): EditorCommand {
  return command.kind === 'mark'
    ? { ...command, before: command.after, after: command.before }
    : { ...command, before: command.after, after: command.before };
}
