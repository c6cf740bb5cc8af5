import { useMemo } from 'react';
import { Link } from 'react-router';
import { createColumnHelper, rowSortingFeature, tableFeatures, useTable, type SortingState } from '@tanstack/react-table';
import type { Shot, ShotSort } from '@shared/schemas/records';
import { ClipStatusBadge } from '@/components/ui/clip-status-badge';
import { cx } from '@/components/ui/cx';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatNumber, formatQuantity } from '@/lib/format';

// Sorting happens on the server (the list is paged), so the table only keeps
// the sorting state and reports changes; column ids are the API's sort keys.
const features = tableFeatures({ rowSortingFeature });
const col = createColumnHelper<typeof features, Shot>();


function LatestClipBadge({ clip }: { clip: Shot['latestClip'] }) {
  if (!clip) return <span className="text-micro text-ink-faint">no clip</span>;
  return <ClipStatusBadge status={clip.status} progress={clip.progress} short />;
}

export interface ShotsTableProps {
  teamId: string;
  shots: Shot[];
  loading: boolean;
  sort: ShotSort;
  dir: 'asc' | 'desc';
  onSortChange: (sort: ShotSort, dir: 'asc' | 'desc') => void;
}

export function ShotsTable({ teamId, shots, loading, sort, dir, onSortChange }: ShotsTableProps) {
  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('label', {
          id: 'label',
          header: 'Shot',
          cell: (info) => (
            <Link to={`/t/${teamId}/shots/${info.row.original.id}`} className="font-medium text-ink underline decoration-line underline-offset-2 hover:decoration-signal">
              {info.getValue()}
            </Link>
          ),
        }),
        col.accessor('seriesName', { id: 'series', header: 'Series' }),
        col.accessor('launcherName', { id: 'launcher', header: 'Launcher', cell: (info) => info.getValue() ?? '—' }),
        col.accessor('projectileName', { id: 'projectile', header: 'Projectile', enableSorting: false, cell: (info) => info.getValue() ?? '—' }),
        col.accessor('elevationDeg', { id: 'elevation', header: 'Elevation', meta: { numeric: true }, cell: (info) => formatQuantity(info.getValue(), '°', { decimals: 1 }) }),
        col.accessor('chamberPressurePa', {
          id: 'pressure',
          header: 'Pressure (kPa)',
          meta: { numeric: true },
          cell: (info) => formatNumber(info.getValue() === null ? null : info.getValue()! / 1000, { decimals: 0 }),
        }),
        col.accessor('latestClip', { id: 'clip', header: 'Clip', enableSorting: false, cell: (info) => <LatestClipBadge clip={info.getValue()} /> }),
      ]),
    [teamId],
  );
  const sorting: SortingState = useMemo(() => [{ id: sort, desc: dir === 'desc' }], [sort, dir]);
  const table = useTable({
    features,
    columns,
    data: shots,
    getRowId: (row) => row.id,
    state: { sorting },
    manualSorting: true,
    enableSortingRemoval: false,
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) onSortChange(first.id as ShotSort, first.desc ? 'desc' : 'asc');
    },
  });

  return (
    <div className="overflow-x-auto rounded-card border border-line bg-paper-raised">
      <table className="w-full border-collapse text-body">
        <caption className="sr-only">Shots</caption>
        <thead className="bg-paper-sunk/70">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                const content = <table.FlexRender header={header} />;
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                    className={cx('border-b border-line px-3 py-2 text-micro font-semibold uppercase tracking-wide whitespace-nowrap text-ink-soft', numeric ? 'text-right' : 'text-left')}
                  >
                    {canSort ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className={cx('inline-flex items-center gap-1 uppercase hover:text-ink', numeric && 'flex-row-reverse')}>
                        {content}
                        <span aria-hidden className={cx('text-[10px]', sorted ? 'text-signal-dark' : 'text-ink-faint/50')}>
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '◆'}
                        </span>
                      </button>
                    ) : (
                      content
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-line/70 last:border-b-0 hover:bg-paper/80">
              {row.getAllCells().map((cell) => {
                const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                return (
                  <td key={cell.id} className={cx('px-3 py-2 align-middle', numeric && 'text-right tabular-nums')}>
                    <table.FlexRender cell={cell} />
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      {loading && shots.length === 0 && <LoadingBlock label="Loading shots…" />}
      {!loading && shots.length === 0 && (
        <div className="p-4">
          <EmptyState title="No shots match.">Change the filters, or record a shot.</EmptyState>
        </div>
      )}
    </div>
  );
}
