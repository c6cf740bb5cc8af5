import { lazy, Suspense, type ReactNode } from 'react';
import { Link } from 'react-router';
import { CAN, ROLE_DUTIES, ROLE_LABELS, type Role } from '@shared/roles';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useTeam } from '@/api/teams/get-team';
import { useWorkQueues } from '@/api/work-queues/get-work-queues';
import { RecentActivityCard } from './recent-activity-card';
import { TeamRulesCard } from './team-rules-card';
import { WorkQueuesCard } from './work-queues-card';

// The charts library is most of this page's weight: it loads after the queues are on screen.
const PresetTrendsCard = lazy(() => import('./preset-trends-card').then((m) => ({ default: m.PresetTrendsCard })));

/** A shortcut on the team home; the router supplies the list (src/app/team-home-slots.ts). */
export interface TeamHomeLink {
  label: string;
  description: string;
  to: (teamId: string) => string;
  /** Who sees it; everyone in the team when left out. */
  roles?: readonly Role[];
}

/** A panel another feature shows on the team home (e.g. recent shots, fits waiting for review). */
export interface TeamHomePanel {
  id: string;
  roles?: readonly Role[];
  render: (teamId: string) => ReactNode;
}

export interface TeamHomePageProps {
  links: readonly TeamHomeLink[];
  panels: readonly TeamHomePanel[];
}

const visibleTo = (role: Role) => (item: { roles?: readonly Role[] }) => !item.roles || item.roles.includes(role);

export function TeamHomePage({ links, panels }: TeamHomePageProps) {
  const { teamId, team, role } = useCurrentTeam();
  const detail = useTeam(teamId);
  const work = useWorkQueues(teamId);
  const myLinks = links.filter(visibleTo(role));
  const myPanels = panels.filter(visibleTo(role));

  return (
    <>
      <PageHeader eyebrow="Team home" title={team.name} subtitle={team.siteName ?? undefined} />
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <FormError error={work.error} />
          {work.data && role !== 'viewer' && <WorkQueuesCard queues={work.data.queues} role={role} />}
          {work.data && <RecentActivityCard teamId={teamId} activity={work.data.activity} />}
          {work.data && (
            <Suspense fallback={null}>
              <PresetTrendsCard trends={work.data.trends} />
            </Suspense>
          )}
          <Card title="What you can do here">
            {myLinks.length === 0 ? (
              <p className="text-body text-ink-soft">Nothing to start yet.</p>
            ) : (
              <ul className="grid gap-3 sm:grid-cols-2">
                {myLinks.map((link) => (
                  <li key={link.label}>
                    <Link
                      to={link.to(teamId)}
                      className="group block h-full rounded-md border border-line bg-paper px-3.5 py-3 hover:border-signal hover:bg-paper-raised"
                    >
                      <span className="flex items-center justify-between text-body font-medium text-ink">
                        {link.label}
                        <span aria-hidden className="text-ink-faint group-hover:text-signal-dark">
                          →
                        </span>
                      </span>
                      <span className="mt-0.5 block text-micro text-ink-soft">{link.description}</span>
                    </Link>
                  </li>
                ))}
              </ul>
            )}
          </Card>
          {myPanels.map((panel) => (
            <div key={panel.id}>{panel.render(teamId)}</div>
          ))}
        </div>
        <div className="flex flex-col gap-5">
          <Card title="Your role">
            <p className="mb-2">
              <Badge tone="signal">{ROLE_LABELS[role]}</Badge>
            </p>
            <p className="text-body text-ink-soft">{ROLE_DUTIES[role]}</p>
          </Card>
          <Card title="Team">
            <FormError error={detail.error} />
            <KeyValueList
              items={[
                { label: 'Name', value: team.name },
                { label: 'Test site', value: team.siteName ?? '—' },
                { label: 'Members', value: detail.data ? detail.data.memberCount : '…', numeric: true },
              ]}
            />
          </Card>
          <TeamRulesCard teamId={teamId} canChange={(CAN.manageMembers as readonly Role[]).includes(role)} />
        </div>
      </div>
    </>
  );
}
