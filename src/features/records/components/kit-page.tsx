import { useMemo, useState } from 'react';
import { CAN } from '@shared/roles';
import type { Launcher, Projectile } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/dialog';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { formatNumber } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useDeleteLauncher } from '@/api/launchers/delete-launcher';
import { useDeleteProjectile } from '@/api/projectiles/delete-projectile';
import { useLaunchers } from '@/api/launchers/list-launchers';
import { useProjectiles } from '@/api/projectiles/list-projectiles';
import { LaunchSafetyNote } from './launch-safety-note';
import { LauncherFormDialog, ProjectileFormDialog } from './kit-form-dialogs';
import { LensProfilesCard } from './lens-profiles-card';

const launcherCol = dataTableColumns<Launcher>();
const projectileCol = dataTableColumns<Projectile>();
const scaled = (value: number | null, factor: number, decimals: number) => formatNumber(value === null ? null : value * factor, { decimals });

/** The team's launchers and projectiles: what each shot names. */
export function KitPage() {
  const { teamId, can } = useCurrentTeam();
  const canEdit = can(CAN.editEquipment);
  const launchers = useLaunchers(teamId);
  const projectiles = useProjectiles(teamId);
  const removeLauncher = useDeleteLauncher(teamId);
  const removeProjectile = useDeleteProjectile(teamId);
  const [launcherEdit, setLauncherEdit] = useState<Launcher | null | undefined>(undefined);
  const [projectileEdit, setProjectileEdit] = useState<Projectile | null | undefined>(undefined);
  const [deleting, setDeleting] = useState<{ kind: 'launcher'; row: Launcher } | { kind: 'projectile'; row: Projectile } | null>(null);

  const rowActions = (onEdit: () => void, onDelete: () => void) =>
    canEdit && (
      <div className="flex justify-end gap-1">
        <Button size="sm" variant="ghost" onClick={onEdit}>
          Edit
        </Button>
        <Button size="sm" variant="ghost" onClick={onDelete}>
          Delete
        </Button>
      </div>
    );

  const launcherColumns = useMemo(
    () =>
      launcherCol.columns([
        launcherCol.accessor('name', { header: 'Launcher', cell: (i) => <span className="font-medium">{i.getValue()}</span> }),
        launcherCol.accessor('boreM', { header: 'Bore (mm)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1000, 0) }),
        launcherCol.accessor('barrelLengthM', { header: 'Barrel (m)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1, 2) }),
        launcherCol.accessor('chamberVolumeM3', { header: 'Chamber (L)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1000, 2) }),
        launcherCol.accessor('maxWorkingPressurePa', { header: 'Max working (kPa)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 0.001, 0) }),
        launcherCol.accessor('valveType', { header: 'Valve', cell: (i) => i.getValue() ?? '—' }),
        launcherCol.display({
          id: 'actions',
          header: '',
          meta: { srHeader: 'Actions' },
          cell: (i) => rowActions(() => setLauncherEdit(i.row.original), () => setDeleting({ kind: 'launcher', row: i.row.original })),
        }),
      ]),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- rowActions only depends on canEdit
    [canEdit],
  );

  const projectileColumns = useMemo(
    () =>
      projectileCol.columns([
        projectileCol.accessor('name', { header: 'Projectile', cell: (i) => <span className="font-medium">{i.getValue()}</span> }),
        projectileCol.accessor('massKg', { header: 'Mass (g)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1000, 1) }),
        projectileCol.accessor('diameterM', { header: 'Diameter (mm)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1000, 1) }),
        projectileCol.accessor('shape', { header: 'Shape', cell: (i) => i.getValue() ?? '—' }),
        projectileCol.accessor('referenceAreaM2', { header: 'Reference area (cm²)', meta: { numeric: true }, cell: (i) => scaled(i.getValue(), 1e4, 2) }),
        projectileCol.display({
          id: 'actions',
          header: '',
          meta: { srHeader: 'Actions' },
          cell: (i) => rowActions(() => setProjectileEdit(i.row.original), () => setDeleting({ kind: 'projectile', row: i.row.original })),
        }),
      ]),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- rowActions only depends on canEdit
    [canEdit],
  );

  const remove = deleting?.kind === 'launcher' ? removeLauncher : removeProjectile;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Launchers & projectiles" subtitle="The kit each shot names. Sizes in mm, volumes in litres, pressures in kPa; stored in SI units." />
      <LaunchSafetyNote />
      <Card
        title="Launchers"
        flush
        actions={canEdit && <Button size="sm" variant="primary" onClick={() => setLauncherEdit(null)}>New launcher</Button>}
      >
        <div className="p-3">
          <FormError error={launchers.error} />
          <DataTable caption="Launchers" columns={launcherColumns} data={launchers.data ?? []} getRowId={(l) => l.id} loading={launchers.isLoading} empty="No launchers yet." filterPlaceholder={false} />
        </div>
      </Card>
      <Card
        title="Projectiles"
        flush
        actions={canEdit && <Button size="sm" variant="primary" onClick={() => setProjectileEdit(null)}>New projectile</Button>}
      >
        <div className="p-3">
          <FormError error={projectiles.error} />
          <DataTable caption="Projectiles" columns={projectileColumns} data={projectiles.data ?? []} getRowId={(p) => p.id} loading={projectiles.isLoading} empty="No projectiles yet." filterPlaceholder={false} />
        </div>
      </Card>
      <LensProfilesCard />
      <LauncherFormDialog teamId={teamId} launcher={launcherEdit ?? null} open={launcherEdit !== undefined} onClose={() => setLauncherEdit(undefined)} />
      <ProjectileFormDialog teamId={teamId} projectile={projectileEdit ?? null} open={projectileEdit !== undefined} onClose={() => setProjectileEdit(undefined)} />
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete ${deleting?.row.name ?? ''}?`}
        description="Only kit no shot names can be deleted, so no shot record loses it."
        confirmLabel="Delete"
        busy={remove.isPending}
        onClose={() => {
          setDeleting(null);
          removeLauncher.reset();
          removeProjectile.reset();
        }}
        onConfirm={() => deleting && remove.mutate(deleting.row.id, { onSuccess: () => setDeleting(null) })}
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </div>
  );
}
