import type { FitAuditEntry } from '@shared/schemas/fits';
import { Card } from '@/components/ui/card';
import { formatDateTime } from '@/lib/format';

const WORDS: Record<string, string> = {
  'fit.run': 'ran the fit',
  'fit.approve': 'approved it',
  'fit.reject': 'rejected it',
};

export function AuditTrail({ entries }: { entries: FitAuditEntry[] }) {
  return (
    <Card title="History">
      <ol className="space-y-1 text-body" aria-label="Fit history">
        {entries.map((e, i) => (
          <li key={i} className="flex flex-wrap gap-x-2">
            <time className="tabular-nums text-ink-faint" dateTime={e.at}>{formatDateTime(e.at)}</time>
            <span className="font-medium">{e.actor?.displayName ?? 'someone'}</span>
            <span>{WORDS[e.action] ?? e.action}</span>
            {typeof e.detail.note === 'string' && e.detail.note && <q className="text-ink-soft">{e.detail.note}</q>}
          </li>
        ))}
      </ol>
    </Card>
  );
}
