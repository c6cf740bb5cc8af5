import { useEffect, useState } from 'react';
import type { ClipFrameView, ClipView } from '@shared/schemas/clips';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { cx } from '@/components/ui/cx';
import { formatQuantity } from '@/lib/format';
import { frameImageUrl, thumbnailImageUrl } from '@/api/clips/frame-images';

const FLAG_WORDS = { 'dropped-before': 'frames missing before this one', duplicate: 'repeats the previous frame' } as const;

/**
 * The source frame a thumbnail shows: the server spreads the strip evenly over
 * the extracted range, ends included (server/jobs/extract-frames.ts, thumbnailFrames).
 */
function thumbnailFrameNumber(n: number, count: number, first: number, last: number): number {
  const span = last - first;
  if (span + 1 <= count) return first + n;
  return first + Math.round((span * n) / (count - 1));
}

/** A strip of thumbnails over the range and one frame at full size, stepped with buttons or the arrow keys. */
export function FrameViewer({ teamId, clip, frames }: { teamId: string; clip: ClipView; frames: ClipFrameView[] }) {
  const [index, setIndex] = useState(0);
  const frame = frames[Math.min(index, frames.length - 1)];
  const version = clip.updatedAt;
  const first = frames[0]?.frameNumber ?? 0;
  const last = frames[frames.length - 1]?.frameNumber ?? 0;

  useEffect(() => setIndex(0), [clip.id, version]);

  if (!frame) return <p className="text-body text-ink-faint">No frames were extracted.</p>;
  const step = (by: number) => setIndex((i) => Math.max(0, Math.min(frames.length - 1, i + by)));
  const goToFrameNumber = (frameNumber: number) => {
    const at = frames.findIndex((f) => f.frameNumber >= frameNumber);
    setIndex(at < 0 ? frames.length - 1 : at);
  };

  return (
    <div className="flex flex-col gap-3">
      {clip.thumbnailCount > 0 && (
        <ol className="flex gap-1 overflow-x-auto rounded-md bg-paper-sunk p-1" aria-label="Thumbnails across the extracted range">
          {Array.from({ length: clip.thumbnailCount }, (_, n) => {
            const frameNumber = thumbnailFrameNumber(n, clip.thumbnailCount, first, last);
            return (
              <li key={n} className="shrink-0">
                <button
                  type="button"
                  onClick={() => goToFrameNumber(frameNumber)}
                  className={cx('block rounded-sm border-2', frame.frameNumber === frameNumber ? 'border-signal' : 'border-transparent hover:border-line')}
                  aria-label={`Go to frame ${frameNumber}`}
                >
                  <img src={thumbnailImageUrl(teamId, clip.id, n, version)} alt="" className="h-14 w-auto" loading="lazy" />
                </button>
              </li>
            );
          })}
        </ol>
      )}
      <div
        tabIndex={0}
        role="group"
        aria-label="Frame viewer: left and right arrow keys step one frame"
        onKeyDown={(e) => {
          if (e.key === 'ArrowRight') step(e.shiftKey ? 10 : 1);
          else if (e.key === 'ArrowLeft') step(e.shiftKey ? -10 : -1);
          else return;
          e.preventDefault();
        }}
        className="overflow-hidden rounded-md border border-line bg-ink"
      >
        <img
          src={frameImageUrl(teamId, clip.id, frame.frameNumber, version)}
          alt={`Frame ${frame.frameNumber} of ${clip.originalName}`}
          width={clip.frameWidth}
          height={clip.frameHeight}
          className="mx-auto block h-auto max-h-[60vh] w-auto max-w-full"
        />
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex items-center gap-2">
          <Button size="sm" onClick={() => step(-1)} disabled={index === 0} aria-label="Previous frame">
            ◀ Previous
          </Button>
          <Button size="sm" onClick={() => step(1)} disabled={index >= frames.length - 1} aria-label="Next frame">
            Next ▶
          </Button>
        </div>
        <p className="text-body tabular-nums text-ink" data-testid="frame-position">
          Frame <strong>{frame.frameNumber}</strong> · {index + 1} of {frames.length} · t = {formatQuantity(frame.tS * 1000, 'ms', { decimals: 2 })}
        </p>
        {frame.flag && <Badge tone="alert">{FLAG_WORDS[frame.flag]}</Badge>}
      </div>
    </div>
  );
}
