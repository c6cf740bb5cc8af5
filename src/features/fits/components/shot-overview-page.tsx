import { useState } from 'react';
import { Link } from 'react-router';
import { FIT_STATE_LABELS, OVERVIEW_STATUSES, type OverviewStatus, type ShotOverviewQuery, type ShotOverviewRow } from '@shared/schemas/fits';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useShotOverview } from '@/api/fits/get-shot-overview';
import { FitStateBadge } from './fit-state-badge';
import { formatDate, formatNumber } from '@/lib/format';

type Sort = NonNullable<ShotOverviewQuery['sort']>;
const COLUMNS: { key: Sort | null; label: string; numeric?: boolean }[] = [
  { key: 'label', label: 'Shot' },
  { key: 'series', label: 'Series' },
  { key: null, label: 'Launcher' },
  { key: null, label: 'Projectile' },
  // The latest fit and the latest approved one side by side, each named, since they are often not the same fit.
  { key: 'status', label: 'Latest fit' },
  { key: 'speed', label: 'Latest speed (m/s)', numeric: true },
  { key: 'cd', label: 'Latest Cd', numeric: true },
  { key: null, label: 'Latest approved fit' },
  // The series' test date: the day the shot was fired. The date it was typed in is "Entered" on the shot page.
  { key: 'created', label: 'Test date' },
];

const statusLabel = (s: OverviewStatus) => (s === 'no-fit' ? 'No fit yet' : FIT_STATE_LABELS[s]);

/** Every shot of the team with its latest fit; filtering, sorting and paging happen on the server. */
export function ShotOverviewPage() {
  const { teamId } = useCurrentTeam();
  const [query, setQuery] = useState<ShotOverviewQuery>({ sort: 'created', dir: 'desc', page: 1, pageSize: 25 });
  const [text, setText] = useState('');
  const { data, error, isPending } = useShotOverview(teamId, query);
  const set = (patch: Partial<ShotOverviewQuery>) => setQuery((q) => ({ ...q, page: 1, ...patch }));
  const sortBy = (key: Sort) => set({ sort: key, dir: query.sort === key && query.dir === 'desc' ? 'asc' : 'desc' });
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  return (
    <div className="space-y-4">
      <PageHeader title="Shot results" subtitle="Each shot with the state and numbers of its latest fit." />
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          set({ q: text || undefined });
        }}
      >
        <label className="flex flex-col text-micro text-ink-soft">
          Search shot or series
          <input type="search" value={text} onChange={(e) => setText(e.target.value)} className="h-8 w-56 rounded-md border border-line bg-paper-raised px-2.5 text-body" />
        </label>
        <label className="flex flex-col text-micro text-ink-soft">
          Status
          <select
            value={query.status ?? ''}
            onChange={(e) => set({ status: (e.target.value || undefined) as OverviewStatus | undefined })}
            className="h-8 rounded-md border border-line bg-paper-raised px-2 text-body"
          >
            <option value="">Any</option>
            {OVERVIEW_STATUSES.map((s) => (
              <option key={s} value={s}>
                {statusLabel(s)}
              </option>
            ))}
          </select>
        </label>
        <Button type="submit" size="sm">
          Apply
        </Button>
      </form>
      <FormError error={error} />
      {isPending ? (
        <LoadingBlock />
      ) : (
        <div className="overflow-x-auto rounded-card border border-line bg-paper-raised">
          <table className="w-full text-body">
            <caption className="sr-only">Shots with their latest fit and their latest approved fit</caption>
            <thead className="bg-paper-sunk/70 text-micro uppercase tracking-wide text-ink-soft">
              <tr>
                {COLUMNS.map((c) => (
                  <th
                    key={c.label}
                    scope="col"
                    className={`px-3 py-2 ${c.numeric ? 'text-right' : 'text-left'}`}
                    aria-sort={c.key && query.sort === c.key ? (query.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                  >
                    {c.key ? (
                      <button type="button" className="uppercase hover:text-ink" onClick={() => sortBy(c.key!)}>
                        {c.label} {query.sort === c.key ? (query.dir === 'asc' ? '▲' : '▼') : ''}
                      </button>
                    ) : (
                      c.label
                    )}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {data?.items.map((r) => <OverviewRow key={r.shotId} teamId={teamId} row={r} />)}
              {data && data.items.length === 0 && (
                <tr>
                  <td colSpan={COLUMNS.length} className="px-3 py-6 text-center text-ink-soft">
                    No shots match.
                  </td>
                </tr>
              )}
            </tbody>
          </table>
        </div>
      )}
      {data && (
        <nav aria-label="Pages" className="flex items-center justify-between text-micro text-ink-soft">
          <span className="tabular-nums">{data.total} shots</span>
          <div className="flex items-center gap-2">
            <Button size="sm" disabled={data.page <= 1} onClick={() => setQuery((q) => ({ ...q, page: data.page - 1 }))}>
              Previous
            </Button>
            <span className="tabular-nums">
              Page {data.page} of {pages}
            </span>
            <Button size="sm" disabled={data.page >= pages} onClick={() => setQuery((q) => ({ ...q, page: data.page + 1 }))}>
              Next
            </Button>
          </div>
        </nav>
      )}
    </div>
  );
}

function OverviewRow({ teamId, row }: { teamId: string; row: ShotOverviewRow }) {
  return (
    <tr className="border-t border-line/70">
      <td className="px-3 py-2">
        <Link className="font-medium text-signal-dark underline" to={`/t/${teamId}/shots/${row.shotId}/fits`}>
          {row.label}
        </Link>
      </td>
      <td className="px-3 py-2">{row.seriesName}</td>
      <td className="px-3 py-2">{row.launcherName ?? '—'}</td>
      <td className="px-3 py-2">{row.projectileName ?? '—'}</td>
      <td className="px-3 py-2">
        {row.status === 'no-fit' ? (
          <span className="text-micro text-ink-faint">No fit yet</span>
        ) : row.fitId ? (
          <Link to={`/t/${teamId}/fits/${row.fitId}`}>
            <FitStateBadge state={row.status} />
          </Link>
        ) : null}
      </td>
      <td className="px-3 py-2 text-right tabular-nums">{row.launchSpeedMps === null ? '—' : formatNumber(row.launchSpeedMps, { decimals: 2 })}</td>
      <td className="px-3 py-2 text-right tabular-nums">{row.dragCoefficient === null ? '—' : formatNumber(row.dragCoefficient, { decimals: 3 })}</td>
      <td className="px-3 py-2 tabular-nums" data-testid="approved-fit">
        {row.approved === null ? (
          <span className="text-micro text-ink-faint">None approved</span>
        ) : row.approved.fitId === row.fitId ? (
          <span className="text-micro text-ink-soft">The latest fit</span>
        ) : (
          <Link className="text-signal-dark underline" to={`/t/${teamId}/fits/${row.approved.fitId}`}>
            {formatNumber(row.approved.launchSpeedMps, { decimals: 2 })}&nbsp;m/s · Cd {row.approved.dragCoefficient === null ? '—' : formatNumber(row.approved.dragCoefficient, { decimals: 3 })}
          </Link>
        )}
      </td>
      <td className="px-3 py-2 tabular-nums text-ink-soft">{formatDate(row.testDate)}</td>
    </tr>
  );
}
