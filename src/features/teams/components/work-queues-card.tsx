import { Link } from 'react-router';
import { ROLE_LABELS, type Role } from '@shared/roles';
import type { WorkQueue } from '@shared/schemas/work-queues';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';

/** One queue per role; the viewer's own role first, the others folded below for the team's overview. */
export function WorkQueuesCard({ queues, role }: { queues: WorkQueue[]; role: Role }) {
  const roles: Role[] = ['analyst', 'tracker', 'engineer', 'admin'];
  // Admins do every job, so they see every queue open; others see their own open first.
  const mine = role === 'admin' ? roles : roles.filter((r) => r === role);
  const others = roles.filter((r) => !mine.includes(r));
  return (
    <Card title="Work waiting" subtitle="What each role has to do next, oldest first.">
      <div className="flex flex-col gap-5">
        {mine.map((r) => (
          <RoleQueues key={r} role={r} queues={queues.filter((q) => q.role === r)} />
        ))}
        {others.length > 0 && (
          <details>
            <summary className="cursor-pointer text-micro font-medium uppercase tracking-wide text-ink-soft">The other roles’ queues</summary>
            <div className="mt-3 flex flex-col gap-5">
              {others.map((r) => (
                <RoleQueues key={r} role={r} queues={queues.filter((q) => q.role === r)} />
              ))}
            </div>
          </details>
        )}
      </div>
    </Card>
  );
}

function RoleQueues({ role, queues }: { role: Role; queues: WorkQueue[] }) {
  return (
    <section aria-label={`${ROLE_LABELS[role]} queues`}>
      <h3 className="mb-2 text-micro font-medium uppercase tracking-wide text-ink-soft">{ROLE_LABELS[role]}</h3>
      <div className="grid gap-3 sm:grid-cols-2">
        {queues.map((q) => (
          <QueueBox key={q.key} queue={q} />
        ))}
      </div>
    </section>
  );
}

function QueueBox({ queue }: { queue: WorkQueue }) {
  return (
    <div role="group" aria-label={queue.title} data-queue={queue.key} className="rounded-md border border-line bg-paper px-3 py-2.5">
      <div className="flex items-center justify-between gap-2">
        <span className="text-body font-medium text-ink">{queue.title}</span>
        <Badge tone={queue.count > 0 ? 'signal' : 'ok'}>
          <span data-testid="queue-count">{queue.count}</span> waiting
        </Badge>
      </div>
      {queue.items.length > 0 && (
        <ul className="mt-2 flex flex-col gap-1">
          {queue.items.map((item) => (
            <li key={item.id} className="text-micro">
              <Link to={item.href} className="font-medium text-ink underline decoration-line-strong underline-offset-2 hover:decoration-signal">
                {item.label}
              </Link>
              {item.detail && <span className="text-ink-faint"> — {item.detail}</span>}
            </li>
          ))}
          {queue.count > queue.items.length && <li className="text-micro text-ink-faint">and {queue.count - queue.items.length} more</li>}
        </ul>
      )}
    </div>
  );
}
