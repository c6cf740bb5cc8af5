import type { FitMarkCounts } from '@shared/schemas/auto-mark';

/** How a fit's marks were made, and which automatic ones it left out, in one line. */
export function markCountsLine(c: FitMarkCounts | undefined): string | null {
  if (!c) return null;
  const pct = `${Math.round(c.reviewThreshold * 100)} %`;
  const made = `${c.automatic} automatic, ${c.byHand} by hand`;
  if (c.leftOut === 0) return `${made}; none left out (review threshold ${pct})`;
  return `${made}; ${c.leftOut} automatic ${c.leftOut === 1 ? 'mark' : 'marks'} below the ${pct} review threshold left out (frames ${c.leftOutFrames.map((f) => f.frameNumber).join(', ')})`;
}
