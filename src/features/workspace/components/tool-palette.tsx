import { cx } from '@/components/ui/cx';
import type { Editor } from '../editor/editor-store';
import type { ToolId } from '../editor/types';
import { useEditor } from '../hooks/use-editor';

interface ToolEntry {
  id: ToolId;
  label: string;
  key: string;
  kind: 'mark' | 'calibrate' | 'view';
  hint: string;
}

export const TOOL_ENTRIES: ToolEntry[] = [
  { id: 'place', label: 'Place', key: 'P', kind: 'mark', hint: 'Click the projectile to mark it and move to the next frame; drag a mark to adjust it.' },
  { id: 'ruler', label: 'Ruler', key: 'R', kind: 'calibrate', hint: 'Click both ends of the scale reference, then type its length.' },
  { id: 'origin-pin', label: 'Origin pin', key: 'O', kind: 'calibrate', hint: 'Click the point that is x = 0, y = 0.' },
  { id: 'horizon', label: 'Horizon', key: 'H', kind: 'calibrate', hint: 'Click two points on a line that is level in the world, or press A to type the roll.' },
  { id: 'plane-fix', label: 'Plane fix', key: 'F', kind: 'calibrate', hint: 'Click four corners of a known rectangle in the flight plane: top-left, top-right, bottom-right, bottom-left.' },
  {
    id: 'straight-edge',
    label: 'Straight edge',
    key: 'E',
    kind: 'calibrate',
    hint: 'Click 3 or more points along an edge that is straight in the world (a rail, a post); Enter or a double-click ends it. Backspace takes back a point.',
  },
  { id: 'hand', label: 'Hand', key: 'G', kind: 'view', hint: 'Drag to move the view.' },
];

export function ToolPalette({ editor }: { editor: Editor }) {
  const active = useEditor(editor, (s) => s.activeTool);
  const { canMark, canCalibrate } = useEditor(editor, (s) => s.permissions);
  const snapOn = useEditor(editor, (s) => s.snapOn);
  const edgeNotice = useEditor(editor, (s) => (s.activeTool === 'straight-edge' ? s.toolStates['straight-edge'].notice : null));
  const allowed = (kind: ToolEntry['kind']) => kind === 'view' || (kind === 'mark' ? canMark : canCalibrate);
  const activeEntry = TOOL_ENTRIES.find((t) => t.id === active);
  return (
    <div className="flex flex-col gap-2">
      <div role="toolbar" aria-label="Tools" className="flex flex-wrap items-center gap-1 rounded-card border border-line bg-paper-raised p-1">
        {TOOL_ENTRIES.map((t) => (
          <button
            key={t.id}
            type="button"
            aria-pressed={active === t.id}
            aria-keyshortcuts={t.key}
            disabled={!allowed(t.kind)}
            title={allowed(t.kind) ? `${t.hint} (${t.key})` : t.kind === 'mark' ? 'Marking needs the frame marker, analyst or admin role.' : 'Calibration needs the analyst or admin role.'}
            onClick={() => editor.setTool(t.id)}
            className={cx(
              'inline-flex h-8 items-center gap-1.5 rounded-md px-2.5 text-body font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-45',
              active === t.id ? 'bg-signal text-ink shadow-sm' : 'text-ink-soft hover:bg-paper-sunk hover:text-ink',
              t.kind === 'calibrate' && 'first-of-type:ml-0',
            )}
          >
            {t.label}
            <kbd className="rounded border border-current/30 px-1 text-[10px] leading-4 opacity-70">{t.key}</kbd>
          </button>
        ))}
        <span className="mx-1 h-6 w-px bg-line" aria-hidden />
        <label className="inline-flex h-8 cursor-pointer items-center gap-1.5 rounded-md px-2 text-body text-ink-soft has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-signal">
          <input type="checkbox" className="accent-[#1f7a72]" checked={snapOn} onChange={(e) => editor.setSnap(e.target.checked)} disabled={!canMark} />
          Snap to centre <kbd className="rounded border border-current/30 px-1 text-[10px] leading-4 opacity-70">N</kbd>
        </label>
      </div>
      {activeEntry && <p className="text-micro text-ink-faint">{activeEntry.hint}</p>}
      {edgeNotice && <p role="status" className="text-micro font-medium text-alert">{edgeNotice}</p>}
      {!canMark && !canCalibrate && (
        <p className="text-micro text-ink-soft">Read-only: your role can look at frames and marks but not change them.</p>
      )}
      {canMark && !canCalibrate && <p className="text-micro text-ink-faint">Calibration tools are for analysts and admins.</p>}
    </div>
  );
}
