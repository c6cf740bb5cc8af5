// Keyboard for the whole workspace. Keys go to the page unless the person is
// typing in a field or a dialog is open, so stepping never steals a digit
// typed into the length box.
import { useEffect, useRef } from 'react';
import type { Editor } from '../editor/editor-store';
import type { ToolId } from '../editor/types';
import { recordStepKey } from '../components/frame-timings';

export const TOOL_KEYS: Record<string, ToolId> = { p: 'place', r: 'ruler', o: 'origin-pin', h: 'horizon', f: 'plane-fix', e: 'straight-edge', g: 'hand' };

function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.closest('dialog[open]')) return true;
  const tag = target.tagName;
  return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT' || target.isContentEditable;
}

export interface WorkspaceKeyActions {
  onHelp: () => void;
  onFit: () => void;
  onZoom: (factor: number) => void;
}

export function useWorkspaceKeys(editor: Editor, actions: WorkspaceKeyActions) {
  const spaceHeld = useRef(false);
  const latest = useRef(actions);
  latest.current = actions;

  useEffect(() => {
    const down = (e: KeyboardEvent) => {
      if (isTyping(e.target) || document.querySelector('dialog[open]')) return;
      const mod = e.ctrlKey || e.metaKey;
      const key = e.key;
      if (mod && (key === 'z' || key === 'Z')) {
        e.preventDefault();
        if (e.shiftKey) editor.redo();
        else editor.undo();
        return;
      }
      if (mod && (key === 'y' || key === 'Y')) {
        e.preventDefault();
        editor.redo();
        return;
      }
      if (mod || e.altKey) return;
      switch (key) {
        case 'ArrowRight':
        case 'ArrowLeft': {
          e.preventDefault();
          recordStepKey(e.timeStamp);
          const by = (key === 'ArrowRight' ? 1 : -1) * (e.shiftKey ? 10 : 1);
          editor.step(by);
          return;
        }
        case 'Home':
        case 'End':
          e.preventDefault();
          editor.goToMarkedEnd(key === 'Home' ? 'first' : 'last');
          return;
        case ' ':
          // Space alone does nothing but arm panning; stop the page from scrolling.
          if (e.target === document.body || (e.target as HTMLElement).dataset?.testid === 'frame-stage') e.preventDefault();
          spaceHeld.current = true;
          return;
        case '?':
          e.preventDefault();
          latest.current.onHelp();
          return;
        case '0':
          latest.current.onFit();
          return;
        case '+':
        case '=':
          latest.current.onZoom(1.25);
          return;
        case '-':
          latest.current.onZoom(0.8);
          return;
        case 's':
        case 'S':
          editor.skipFrame();
          return;
        case 'n':
        case 'N':
          editor.setSnap(!editor.getState().snapOn);
          return;
        case 'Escape':
          editor.cancelSkip();
          editor.toolEvent({ type: 'cancel' });
          return;
        case '[':
        case ']': {
          const { tracks, activeTrackId } = editor.getState();
          const i = tracks.findIndex((t) => t.id === activeTrackId);
          const next = tracks[(i + (key === ']' ? 1 : tracks.length - 1)) % tracks.length];
          if (next) editor.setActiveTrack(next.id);
          return;
        }
      }
      const tool = TOOL_KEYS[key.toLowerCase()];
      // In the horizon tool "a" means "type the angle", so tool letters are checked after the tool had its say.
      editor.toolEvent({ type: 'key', key });
      if (tool && !(editor.getState().activeTool === 'horizon' && key.toLowerCase() === 'a')) editor.setTool(tool);
      if (key === 'Delete' || key === 'Backspace') e.preventDefault();
    };
    const up = (e: KeyboardEvent) => {
      if (e.key === ' ') spaceHeld.current = false;
    };
    const blur = () => (spaceHeld.current = false);
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    window.addEventListener('blur', blur);
    return () => {
      window.removeEventListener('keydown', down);
      window.removeEventListener('keyup', up);
      window.removeEventListener('blur', blur);
    };
  }, [editor]);

  return { spaceHeld };
}

/** Shown in the help dialog; kept beside the handler so the two stay in step. */
export const SHORTCUTS: { keys: string; what: string }[] = [
  { keys: '→ / ←', what: 'Next / previous frame' },
  { keys: 'Shift + → / ←', what: 'Ten frames on / back' },
  { keys: 'Home / End', what: 'First / last marked frame of the track' },
  { keys: 'P', what: 'Place: click to mark and move on; drag a mark to adjust' },
  { keys: 'Delete', what: 'Remove the mark on this frame' },
  { keys: 'S', what: 'Skip this frame (projectile hidden) and move on; on a marked frame, press twice to remove the mark' },
  { keys: 'N', what: 'Snap to the projectile centre on or off' },
  { keys: '[ / ]', what: 'Previous / next track' },
  { keys: 'R', what: 'Ruler: two ends of the scale reference, then its length' },
  { keys: 'O', what: 'Origin pin: click where x = 0, y = 0' },
  { keys: 'H', what: 'Horizon: two points on a level line (A types the angle)' },
  { keys: 'F', what: 'Plane fix: four corners of a known rectangle' },
  { keys: 'E', what: 'Straight edge: 3 or more points along an edge straight in the world; Enter or a double-click ends it' },
  { keys: 'Backspace', what: 'Straight edge: take back the last point (on an empty edge, reopens the last one)' },
  { keys: 'Delete (straight edge)', what: 'Clear every straight edge (Ctrl + Z brings them back)' },
  { keys: 'G or hold Space', what: 'Move the view by dragging (middle button works too)' },
  { keys: 'Wheel, + / −', what: 'Zoom at the cursor / in and out' },
  { keys: '0', what: 'Fit the frame to the window' },
  { keys: 'Ctrl + Z', what: 'Undo' },
  { keys: 'Ctrl + Shift + Z or Ctrl + Y', what: 'Redo' },
  { keys: 'Esc', what: 'Cancel what the tool is halfway through' },
  { keys: '?', what: 'This list' },
];
