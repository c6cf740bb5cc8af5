import type { PoolPreview } from '@shared/schemas/presets';
import { formatNumber, formatPercent } from '@/lib/format';

/** The pooled values whose fits disagree, in words: "Drag coefficient: I² 78% (Cochran's Q p = 0.003)". */
export function disagreements(preview: PoolPreview): string[] {
  const lines: string[] = [];
  for (const [label, p] of [['Drag coefficient', preview.dragCoefficient], ['Launcher efficiency', preview.efficiency]] as const) {
    if (!p?.disagree) continue;
    const pText = p.pValue === null ? '' : ` (Cochran’s Q p = ${formatNumber(p.pValue, { digits: 2 })})`;
    lines.push(`${label}: I² ${formatPercent(p.iSquared, 0)}${pText}`);
  }
  return lines;
}
