import type { ClipStatus } from '@shared/schemas/clips';
import { Badge, type BadgeTone } from './badge';

// A clip's extraction state as a badge, the same tone everywhere; tables use
// the short words, the clip's own page the full sentence-like ones.
const STATUS: Record<ClipStatus, { tone: BadgeTone; words: string; short: string }> = {
  queued: { tone: 'signal', words: 'Waiting for the worker', short: 'waiting' },
  extracting: { tone: 'signal', words: 'Extracting frames', short: 'extracting' },
  ready: { tone: 'ok', words: 'Frames ready', short: 'frames ready' },
  failed: { tone: 'alert', words: 'Extraction failed', short: 'failed' },
  cancelled: { tone: 'neutral', words: 'Extraction cancelled', short: 'cancelled' },
};

export interface ClipStatusBadgeProps {
  status: ClipStatus;
  /** Short words for table cells. */
  short?: boolean;
  /** 0 … 1; shown while extracting. */
  progress?: number;
}

export function ClipStatusBadge({ status, short = false, progress }: ClipStatusBadgeProps) {
  const s = STATUS[status] ?? { tone: 'neutral' as const, words: status, short: status };
  return (
    <Badge tone={s.tone}>
      {short ? s.short : s.words}
      {status === 'extracting' && progress !== undefined && ` ${Math.round(progress * 100)}%`}
    </Badge>
  );
}
