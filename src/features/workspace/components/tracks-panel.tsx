import { useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { cx } from '@/components/ui/cx';
import type { Editor } from '../editor/editor-store';
import type { TrackKind } from '../editor/types';
import { useEditor } from '../hooks/use-editor';
import { MarkingDoneControl } from './marking-done-control';

interface TracksPanelProps {
  editor: Editor;
  onAdd: (kind: TrackKind) => Promise<unknown>;
  adding: boolean;
  /** For the hand-off control of the active track; left out, no control shows. */
  teamId?: string;
  clipId?: string;
}

export function TracksPanel({ editor, onAdd, adding, teamId, clipId }: TracksPanelProps) {
  const tracks = useEditor(editor, (s) => s.tracks);
  const active = useEditor(editor, (s) => s.activeTrackId);
  const marksByTrack = useEditor(editor, (s) => s.marksByTrack);
  const canMark = useEditor(editor, (s) => s.permissions.canMark);
  const [error, setError] = useState<string | null>(null);
  const add = (kind: TrackKind) => onAdd(kind).then(() => setError(null), (e: Error) => setError(e.message));
  return (
    <Card title="Tracks" subtitle="[ and ] switch between them">
      <ul className="flex flex-col gap-1" aria-label="Tracks">
        {tracks.map((t) => {
          const count = Object.keys(marksByTrack[t.id] ?? {}).length;
          return (
            <li key={t.id}>
              <button
                type="button"
                aria-pressed={t.id === active}
                onClick={() => editor.setActiveTrack(t.id)}
                className={cx(
                  'flex w-full items-center justify-between gap-2 rounded-md border px-2.5 py-1.5 text-left text-body',
                  t.id === active ? 'border-signal bg-signal-light/50 text-ink' : 'border-line bg-paper-raised text-ink-soft hover:bg-paper-sunk',
                )}
              >
                <span className="truncate font-medium">{t.label}</span>
                <span className="flex items-center gap-1.5">
                  {t.kind === 'muzzle' && <Badge>muzzle</Badge>}
                  <span className="tabular-nums text-micro text-ink-faint">{count} marks</span>
                </span>
              </button>
            </li>
          );
        })}
      </ul>
      {canMark && (
        <div className="mt-3 flex flex-wrap gap-2">
          <Button size="sm" onClick={() => add('projectile')} busy={adding}>Add projectile track</Button>
          <Button size="sm" variant="ghost" onClick={() => add('muzzle')} disabled={adding}>Add muzzle point</Button>
        </div>
      )}
      {error && <p role="alert" className="mt-2 text-micro text-alert">{error}</p>}
      {teamId && clipId && <MarkingDoneControl teamId={teamId} clipId={clipId} trackId={active} canMark={canMark} />}
    </Card>
  );
}
