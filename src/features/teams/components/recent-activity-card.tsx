import { Link } from 'react-router';
import type { ActivityEntry } from '@shared/schemas/work-queues';
import { Card } from '@/components/ui/card';
import { formatDateTime } from '@/lib/format';
import { thumbnailImageUrl } from '@/api/clips/frame-images';

/** What the team did lately, each with a frame of its clip when there is one. */
export function RecentActivityCard({ teamId, activity }: { teamId: string; activity: ActivityEntry[] }) {
  return (
    <Card title="Recent activity">
      {activity.length === 0 ? (
        <p className="text-body text-ink-soft">Nothing yet.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-line" aria-label="Recent activity">
          {activity.map((a) => {
            const body = (
              <>
                <span className="text-ink">
                  <span className="font-medium">{a.actor ?? 'Someone'}</span> {a.text}
                </span>
                <span className="block text-micro text-ink-faint">{formatDateTime(a.at)}</span>
              </>
            );
            return (
              <li key={a.id} className="flex items-center gap-3 py-2 text-body">
                {a.thumbnail ? (
                  <img src={thumbnailImageUrl(teamId, a.thumbnail.clipId, a.thumbnail.n)} alt="" className="h-10 w-16 shrink-0 rounded border border-line bg-paper-sunk object-cover" loading="lazy" />
                ) : (
                  <span aria-hidden className="h-10 w-16 shrink-0 rounded border border-line bg-paper-sunk" />
                )}
                <div className="min-w-0">{a.href ? <Link to={a.href} className="hover:underline">{body}</Link> : body}</div>
              </li>
            );
          })}
        </ul>
      )}
    </Card>
  );
}
