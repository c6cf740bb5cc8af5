import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { AUTO_MARK_SHORTCUTS } from '../hooks/use-auto-mark-keys';
import { SHORTCUTS } from '../hooks/use-workspace-keys';

export function ShortcutHelpDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Keys in the workspace" size="md" footer={<Button onClick={onClose} autoFocus>Close</Button>}>
      <table className="w-full text-body">
        <caption className="sr-only">Keyboard shortcuts</caption>
        <tbody>
          {[...SHORTCUTS, ...AUTO_MARK_SHORTCUTS].map((s) => (
            <tr key={s.keys} className="border-b border-line/60 last:border-0">
              <th scope="row" className="py-1.5 pr-4 text-left font-medium whitespace-nowrap text-ink">
                <kbd className="rounded border border-line bg-paper-sunk px-1.5 py-px text-micro">{s.keys}</kbd>
              </th>
              <td className="py-1.5 text-ink-soft">{s.what}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </Dialog>
  );
}
