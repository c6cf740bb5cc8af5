import { useState, type ReactNode } from 'react';
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { Button } from './button';
import { cx } from './cx';
import { EmptyState } from './empty-state';
import { LoadingBlock } from './spinner';

/** Per-column hints the table reads from `meta`. */
export interface DataTableColumnMeta {
  /** Right-aligned, tabular figures. */
  numeric?: boolean;
  /** Header text for screen readers when the visible header is empty (e.g. an actions column). */
  srHeader?: string;
  className?: string;
}

// Registered once at module scope: TanStack Table v9 wants stable feature objects.
export const dataTableFeatures = tableFeatures({
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  filterFns: { includesString: filterFn_includesString },
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime, basic: sortFn_basic },
  columnMeta: {} as DataTableColumnMeta,
});
export type DataTableFeatures = typeof dataTableFeatures;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- column value types differ per column
export type DataTableColumn<T extends RowData> = ColumnDef<DataTableFeatures, T, any>;

/**
 * Typed column helper for DataTable. Build columns at module scope or in useMemo:
 *   const col = dataTableColumns<Member>();
 *   const columns = col.columns([col.accessor('email', { header: 'E-mail' })]);
 */
export function dataTableColumns<T extends RowData>() {
  return createColumnHelper<DataTableFeatures, T>();
}

export interface ServerPagination {
  /** 1-based. */
  page: number;
  pageSize: number;
  total: number;
  onPageChange: (page: number) => void;
}

export interface DataTableProps<T extends RowData> {
  /** Names the table for screen readers (rendered as a hidden caption). */
  caption: string;
  columns: DataTableColumn<T>[];
  data: readonly T[];
  getRowId?: (row: T) => string;
  loading?: boolean;
  /** What to say when there are no rows at all. */
  empty?: ReactNode;
  /** Placeholder of the filter box; false hides it. Filters only the rows loaded in the browser. */
  filterPlaceholder?: string | false;
  initialSorting?: SortingState;
  /** Pages served by the API; client sorting and filtering then apply to the current page only. */
  pagination?: ServerPagination;
  /**
   * Sorting done by the API: pass the current order and a setter that refetches.
   * The table then only shows the header state and keeps the rows in the order given.
   */
  serverSorting?: { sorting: SortingState; onSortingChange: (sorting: SortingState) => void };
  /** Extra controls on the toolbar's right, next to the filter. */
  toolbar?: ReactNode;
  /** Highlights one row, e.g. the message open in a viewer. */
  selectedRowId?: string;
  dense?: boolean;
}

const EMPTY_SORTING: SortingState = [];

// The first column is pinned while a wide table scrolls sideways (narrow screens): opaque
// backgrounds so scrolled cells pass under it, and a hairline on its right edge.
const PINNED_HEAD = 'sticky left-0 z-10 bg-paper-sunk shadow-[inset_-1px_0_0_#e2dccf]';
const PINNED_CELL = 'sticky left-0 z-10 bg-paper-raised group-hover/row:bg-paper shadow-[inset_-1px_0_0_#e2dccf]';

export function DataTable<T extends RowData>({
  caption,
  columns,
  data,
  getRowId,
  loading = false,
  empty = 'Nothing here yet.',
  filterPlaceholder = 'Filter…',
  initialSorting = EMPTY_SORTING,
  pagination,
  serverSorting,
  toolbar,
  selectedRowId,
  dense = false,
}: DataTableProps<T>) {
  const [localSorting, setLocalSorting] = useState<SortingState>(initialSorting);
  const sorting = serverSorting?.sorting ?? localSorting;
  const [globalFilter, setGlobalFilter] = useState('');
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data: data as T[],
    getRowId: getRowId ? (row: T) => getRowId(row) : undefined, // row ids let selection survive re-sorting
    state: { sorting, globalFilter },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      if (serverSorting) serverSorting.onSortingChange(next);
      else setLocalSorting(next);
    },
    manualSorting: serverSorting !== undefined,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: 'includesString',
  });
  const rows = table.getRowModel().rows;
  const showToolbar = filterPlaceholder !== false || toolbar;
  const cellPad = dense ? 'px-3 py-1' : 'px-3 py-2';

  return (
    <div className="flex flex-col gap-2">
      {showToolbar && (
        <div className="flex flex-wrap items-center justify-between gap-2">
          {filterPlaceholder !== false ? (
            <input
              type="search"
              aria-label={`Filter ${caption.toLowerCase()}`}
              placeholder={filterPlaceholder}
              value={globalFilter}
              onChange={(e) => setGlobalFilter(e.target.value)}
              className="h-8 w-64 max-w-full rounded-md border border-line bg-paper-raised px-2.5 text-body placeholder:text-ink-faint/70"
            />
          ) : (
            <span />
          )}
          {toolbar && <div className="flex items-center gap-2">{toolbar}</div>}
        </div>
      )}
      {/* A table wider than its card scrolls inside the card; the first column stays pinned so each row keeps its name. */}
      <div className="overflow-x-auto rounded-card border border-line bg-paper-raised" data-table-scroll>
        <table className="w-full border-separate border-spacing-0 text-body">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-paper-sunk/70">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header, index) => {
                  const meta = header.column.columnDef.meta;
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  const content = header.isPlaceholder ? null : <table.FlexRender header={header} />;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                      className={cx(
                        'border-b border-line text-micro font-semibold uppercase tracking-wide text-ink-soft whitespace-nowrap',
                        index === 0 && PINNED_HEAD,
                        cellPad,
                        meta?.numeric ? 'text-right' : 'text-left',
                        meta?.className,
                      )}
                    >
                      {meta?.srHeader && <span className="sr-only">{meta.srHeader}</span>}
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={cx('inline-flex items-center gap-1 rounded-sm uppercase hover:text-ink', meta?.numeric && 'flex-row-reverse')}
                        >
                          {content}
                          <SortMark direction={sorted} />
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
            {rows.map((row) => (
              <tr
                key={row.id}
                aria-selected={selectedRowId !== undefined ? row.id === selectedRowId : undefined}
                className={cx('group/row [&:last-child>td]:border-b-0 hover:bg-paper/80', row.id === selectedRowId && 'bg-signal-light/40')}
              >
                {row.getAllCells().map((cell, index) => {
                  const meta = cell.column.columnDef.meta;
                  return (
                    <td
                      key={cell.id}
                      className={cx(cellPad, 'border-b border-line/70 align-middle', index === 0 && PINNED_CELL, meta?.numeric && 'text-right tabular-nums', meta?.className)}
                    >
                      <table.FlexRender cell={cell} />
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
        {loading && rows.length === 0 && <LoadingBlock />}
        {!loading && rows.length === 0 && (
          <div className="p-4">
            {data.length === 0 ? <EmptyState title={empty} /> : <EmptyState title="No rows match the filter." />}
          </div>
        )}
      </div>
      {pagination && <Pager {...pagination} />}
    </div>
  );
}

function SortMark({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden className={cx('text-[10px]', direction ? 'text-signal-dark' : 'text-ink-faint/50')}>
      {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '◆'}
    </span>
  );
}

function Pager({ page, pageSize, total, onPageChange }: ServerPagination) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  // Nothing to page through: the empty state or the rows say it all.
  if (total === 0 && page === 1) return null;
  return (
    <nav aria-label="Pages" className="flex items-center justify-between gap-4 text-micro text-ink-soft">
      <span className="tabular-nums">
        {first}–{last} of {total}
      </span>
      <div className={cx('flex items-center gap-2', pages === 1 && page === 1 && 'hidden')}>
        <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => onPageChange(page - 1)}>
          Previous
        </Button>
        <span className="tabular-nums">
          Page {page} of {pages}
        </span>
        <Button size="sm" variant="secondary" disabled={page >= pages} onClick={() => onPageChange(page + 1)}>
          Next
        </Button>
      </div>
    </nav>
  );
}
