import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import { CAN } from '@shared/roles';
import type { Series } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { ButtonLink } from '@/components/ui/button-link';
import { ConfirmDialog } from '@/components/ui/dialog';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { formatDate } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useDeleteSeries } from '@/api/series/delete-series';
import { useSeriesList } from '@/api/series/list-series';
import { SeriesFormDialog } from './series-form-dialog';

const col = dataTableColumns<Series>();

export function SeriesPage() {
  const { teamId, team, can } = useCurrentTeam();
  const canEdit = can(CAN.editShots);
  const list = useSeriesList(teamId);
  const remove = useDeleteSeries(teamId);
  const [editing, setEditing] = useState<Series | null | undefined>(undefined);
  const [deleting, setDeleting] = useState<Series | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('name', {
          header: 'Series',
          cell: (info) => (
            <Link to={`/t/${teamId}/shots?seriesId=${info.row.original.id}`} className="font-medium underline decoration-line underline-offset-2 hover:decoration-signal">
              {info.getValue()}
            </Link>
          ),
        }),
        col.accessor('testDate', { header: 'Date', cell: (info) => formatDate(info.getValue()) }),
        col.accessor('site', { header: 'Site', cell: (info) => info.getValue() ?? '—' }),
        col.accessor('shotCount', { header: 'Shots', meta: { numeric: true } }),
        col.display({
          id: 'actions',
          header: '',
          meta: { srHeader: 'Actions', className: 'text-right' },
          cell: (info) => {
            const series = info.row.original;
            return (
              <div className="flex justify-end gap-1">
                {canEdit && (
                  <>
                    <ButtonLink size="sm" variant="ghost" to={`/t/${teamId}/shots/new?seriesId=${series.id}`}>
                      Add shot
                    </ButtonLink>
                    <Button size="sm" variant="ghost" onClick={() => setEditing(series)}>
                      Edit
                    </Button>
                    <Button size="sm" variant="ghost" onClick={() => setDeleting(series)}>
                      Delete
                    </Button>
                  </>
                )}
              </div>
            );
          },
        }),
      ]),
    [teamId, canEdit],
  );

  return (
    <div>
      <PageHeader
        title="Test series"
        subtitle="Sessions of shots, each on one day at one site."
        actions={
          canEdit && (
            <Button variant="primary" onClick={() => setEditing(null)}>
              New series
            </Button>
          )
        }
      />
      <FormError error={list.error} className="mb-4" />
      <DataTable
        caption="Test series"
        columns={columns}
        data={list.data ?? []}
        getRowId={(s) => s.id}
        loading={list.isLoading}
        empty="No test series yet."
        filterPlaceholder="Filter series…"
      />
      <SeriesFormDialog teamId={teamId} defaultSite={team.siteName} series={editing ?? null} open={editing !== undefined} onClose={() => setEditing(undefined)} />
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete ${deleting?.name ?? 'series'}?`}
        description="Only a series without shots can be deleted, so no shot record is lost with it."
        confirmLabel="Delete series"
        busy={remove.isPending}
        onClose={() => {
          setDeleting(null);
          remove.reset();
        }}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) })}
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </div>
  );
}
