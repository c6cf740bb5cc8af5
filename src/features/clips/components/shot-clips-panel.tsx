import { useState } from 'react';
import type { ClipView } from '@shared/schemas/clips';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { cx } from '@/components/ui/cx';
import { EmptyState } from '@/components/ui/empty-state';
import { FormError } from '@/components/ui/form-error';
import { LoadingBlock } from '@/components/ui/spinner';
import { useShotClips } from '@/api/clips/list-shot-clips';
import { ClipDetail } from './clip-detail';
import { ClipStatusBadge } from '@/components/ui/clip-status-badge';
import { UploadClipForm } from './upload-clip-form';

/** The clips of one shot: upload, pick one, follow its extraction, look at its frames. */
export function ShotClipsPanel({ teamId, shotId, canEdit }: { teamId: string; shotId: string; canEdit: boolean }) {
  const list = useShotClips(teamId, shotId);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [justUploaded, setJustUploaded] = useState<ClipView | null>(null);
  const [showUpload, setShowUpload] = useState(false);

  if (list.isLoading) return <LoadingBlock label="Loading clips…" />;
  if (list.error) return <FormError error={list.error} />;
  const clips = list.data ?? [];
  // Newest first is what an analyst wants to see; the API lists oldest first.
  const newest = clips[clips.length - 1];
  const currentId = selectedId ?? justUploaded?.id ?? newest?.id ?? null;
  const uploadOpen = canEdit && (clips.length === 0 || showUpload);

  return (
    <div className="flex flex-col gap-4">
      {clips.length > 1 && (
        <Card title="Clips of this shot" flush>
          <ul className="divide-y divide-line">
            {[...clips].reverse().map((c) => (
              <li key={c.id}>
                <button
                  type="button"
                  onClick={() => setSelectedId(c.id)}
                  aria-current={c.id === currentId || undefined}
                  className={cx('flex w-full items-center justify-between gap-3 px-4 py-2 text-left hover:bg-paper', c.id === currentId && 'bg-signal-light/30')}
                >
                  <span className="truncate text-body">{c.originalName}</span>
                  <ClipStatusBadge status={c.status} />
                </button>
              </li>
            ))}
          </ul>
        </Card>
      )}
      {currentId && (
        <ClipDetail
          key={currentId}
          teamId={teamId}
          clipId={currentId}
          initial={justUploaded?.id === currentId ? justUploaded : clips.find((c) => c.id === currentId)}
          canEdit={canEdit}
          onDeleted={() => {
            setSelectedId(null);
            setJustUploaded(null);
          }}
        />
      )}
      {clips.length === 0 && !canEdit && <EmptyState title="No clip yet">An analyst uploads the shot’s clip here.</EmptyState>}
      {uploadOpen ? (
        <Card title={clips.length === 0 ? 'Upload the shot’s clip' : 'Upload another clip'} subtitle="The frames are extracted in the background; you can leave this page meanwhile.">
          <UploadClipForm
            teamId={teamId}
            shotId={shotId}
            onUploaded={(clip) => {
              setJustUploaded(clip);
              setSelectedId(clip.id);
              setShowUpload(false);
            }}
          />
        </Card>
      ) : (
        canEdit && (
          <div>
            <Button variant="ghost" onClick={() => setShowUpload(true)}>
              Upload another clip
            </Button>
          </div>
        )
      )}
    </div>
  );
}
