import { useSyncExternalStore } from 'react';
import type { Editor, EditorState } from '../editor/editor-store';

/**
 * A slice of the editor's state; the component re-renders only when that
 * slice changes (by identity), so stepping a frame does not re-render the
 * ledger and a new mark does not re-render the tool palette.
 */
export function useEditor<T>(editor: Editor, select: (state: EditorState) => T): T {
  return useSyncExternalStore(editor.subscribe, () => select(editor.getState()));
}
