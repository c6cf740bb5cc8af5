import { Button } from '@/components/ui/button';
import type { Editor } from '../editor/editor-store';
import { useEditor } from '../hooks/use-editor';

/** Skip was pressed on a frame that has a mark: say so, and let the person remove it or keep it. */
export function SkipConfirmNote({ editor }: { editor: Editor }) {
  const pending = useEditor(editor, (s) => s.skipNeedsConfirm);
  if (!pending) return null;
  return (
    <div role="alert" className="flex flex-wrap items-center gap-2 rounded-md border border-signal/60 bg-signal-light/40 px-3 py-2 text-body" data-testid="skip-confirm">
      <span>This frame already has a mark. Press S again to remove it and skip, or Esc to keep it.</span>
      <Button size="sm" variant="danger" onClick={() => editor.skipFrame({ removeMark: true })}>
        Remove mark and skip
      </Button>
      <Button size="sm" onClick={() => editor.cancelSkip()}>
        Keep the mark
      </Button>
    </div>
  );
}
