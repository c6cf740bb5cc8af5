import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { formatDateTime } from '@/lib/format';
import { useTracks } from '@/api/tracks/list-tracks';
import { useSetMarkingDone } from '@/api/tracks/set-marking-done';

/**
 * The hand-off of the marking stage: "Ready for fitting" moves the active track to
 * the engineers' queue and mails them; pressing it again takes the track back.
 */
export function MarkingDoneControl({ teamId, clipId, trackId, canMark }: { teamId: string; clipId: string; trackId: string | null; canMark: boolean }) {
  const tracks = useTracks(teamId, clipId);
  const setDone = useSetMarkingDone(teamId);
  const track = tracks.data?.tracks.find((t) => t.id === trackId);
  if (!track) return null;
  const done = track.markingDone;
  return (
    <div className="mt-3 border-t border-line pt-3" data-testid="marking-done">
      {done ? (
        <p className="mb-2 text-micro text-ink-soft">
          Handed to the engineers{done.by ? ` by ${done.by.displayName}` : ''} on {formatDateTime(done.at)}.
        </p>
      ) : (
        <p className="mb-2 text-micro text-ink-soft">When every frame with the projectile is marked, hand the track to the engineers for a fit.</p>
      )}
      {canMark && (
        <Button
          size="sm"
          variant={done ? 'ghost' : 'primary'}
          busy={setDone.isPending}
          onClick={() => setDone.mutate({ trackId: track.id, done: !done })}
        >
          {done ? 'Take back for more marking' : 'Ready for fitting'}
        </Button>
      )}
      <FormError error={setDone.error} />
    </div>
  );
}
