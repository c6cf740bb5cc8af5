import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { CAN } from '@shared/roles';
import { LensProfileCreateBody, type LensProfile } from '@shared/schemas/lens-profiles';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog, Dialog } from '@/components/ui/dialog';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { applyApiFieldErrors } from '@/lib/form-errors';
import { formatNumber } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useCreateLensProfile } from '@/api/lens-profiles/create-lens-profile';
import { useDeleteLensProfile } from '@/api/lens-profiles/delete-lens-profile';
import { useLensProfiles } from '@/api/lens-profiles/list-lens-profiles';
import { useUpdateLensProfile } from '@/api/lens-profiles/update-lens-profile';
import { QuantityField } from './quantity-field';

const col = dataTableColumns<LensProfile>();
const withUnc = (value: number, unc: number) => (unc > 0 ? `${formatNumber(value, { digits: 4 })} ± ${formatNumber(unc, { digits: 2 })}` : formatNumber(value, { digits: 4 }));

/** Lenses the team measured once; a calibration may name one and copies its coefficients. */
export function LensProfilesCard() {
  const { teamId, can } = useCurrentTeam();
  const canEdit = can(CAN.editEquipment);
  const profiles = useLensProfiles(teamId);
  const remove = useDeleteLensProfile(teamId);
  const [editing, setEditing] = useState<LensProfile | null | undefined>(undefined);
  const [deleting, setDeleting] = useState<LensProfile | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('name', { header: 'Lens profile', cell: (i) => <span className="font-medium">{i.getValue()}</span> }),
        col.accessor('cameraNote', { header: 'Camera and mode', cell: (i) => i.getValue() ?? '—' }),
        col.display({ id: 'k1', header: 'k1', meta: { numeric: true }, cell: (i) => withUnc(i.row.original.coefficients.k1, i.row.original.coefficients.k1StdUnc) }),
        col.display({ id: 'k2', header: 'k2', meta: { numeric: true }, cell: (i) => withUnc(i.row.original.coefficients.k2, i.row.original.coefficients.k2StdUnc) }),
        col.display({ id: 'frame', header: 'Frame (px)', meta: { numeric: true }, cell: (i) => `${i.row.original.frameWidthPx}×${i.row.original.frameHeightPx}` }),
        col.display({
          id: 'actions',
          header: '',
          meta: { srHeader: 'Actions' },
          cell: (i) =>
            canEdit && (
              <div className="flex justify-end gap-1">
                <Button size="sm" variant="ghost" onClick={() => setEditing(i.row.original)}>
                  Edit
                </Button>
                <Button size="sm" variant="ghost" onClick={() => setDeleting(i.row.original)}>
                  Delete
                </Button>
              </div>
            ),
        }),
      ]),
    [canEdit],
  );

  return (
    <Card
      title="Lens profiles"
      subtitle="Brown–Conrady radial coefficients k1, k2 on the radius normalised by the frame’s half-diagonal, as the workspace’s straight-edge fit reports them. A calibration that names a profile keeps a copy of its numbers."
      flush
      actions={canEdit && <Button size="sm" variant="primary" onClick={() => setEditing(null)}>New lens profile</Button>}
    >
      <div className="p-3">
        <FormError error={profiles.error} />
        <DataTable caption="Lens profiles" columns={columns} data={profiles.data ?? []} getRowId={(p) => p.id} loading={profiles.isLoading} empty="No lens profiles yet." filterPlaceholder={false} />
      </div>
      <Dialog open={editing !== undefined} onClose={() => setEditing(undefined)} title={editing ? `Edit ${editing.name}` : 'New lens profile'} size="lg">
        {editing !== undefined && <LensProfileForm key={editing?.id ?? 'new'} teamId={teamId} profile={editing} onDone={() => setEditing(undefined)} />}
      </Dialog>
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete ${deleting?.name ?? ''}?`}
        description="Calibrations that used this profile keep their copy of its coefficients."
        confirmLabel="Delete"
        busy={remove.isPending}
        onClose={() => {
          setDeleting(null);
          remove.reset();
        }}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) })}
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </Card>
  );
}

type ProfileInput = z.input<typeof LensProfileCreateBody>;
const FIELDS = ['name', 'cameraNote', 'coefficients.k1', 'coefficients.k2', 'coefficients.k1StdUnc', 'coefficients.k2StdUnc', 'coefficients.k1k2Correlation', 'frameWidthPx', 'frameHeightPx'] as const;
const unset = null as unknown as number;

function LensProfileForm({ teamId, profile, onDone }: { teamId: string; profile: LensProfile | null; onDone: () => void }) {
  const create = useCreateLensProfile(teamId);
  const update = useUpdateLensProfile(teamId);
  const [failure, setFailure] = useState<{ error: unknown; placed: string[] } | null>(null);
  const { register, control, handleSubmit, setError, formState } = useForm<ProfileInput, unknown, z.output<typeof LensProfileCreateBody>>({
    resolver: zodResolver(LensProfileCreateBody),
    defaultValues: {
      name: profile?.name ?? '',
      cameraNote: profile?.cameraNote ?? '',
      coefficients: profile?.coefficients ?? { k1: unset, k2: 0, k1StdUnc: 0, k2StdUnc: 0, k1k2Correlation: 0 },
      frameWidthPx: profile?.frameWidthPx ?? unset,
      frameHeightPx: profile?.frameHeightPx ?? unset,
    },
  });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await (profile ? update.mutateAsync({ id: profile.id, body: values }) : create.mutateAsync(values));
      onDone();
    } catch (error) {
      setFailure({ error, placed: applyApiFieldErrors(error, setError, FIELDS) });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" required error={formState.errors.name?.message} {...register('name')} />
      <TextField label="Camera, lens and mode" placeholder="e.g. wide, 2.7K at 120 fps" error={formState.errors.cameraNote?.message} {...register('cameraNote')} />
      <QuantityField control={control} name="coefficients.k1" label="k1" unit="no unit" bounds={[-2, 2]} required hint="Negative: barrel (straight lines bow outwards)." />
      <QuantityField control={control} name="coefficients.k1StdUnc" label="k1 standard uncertainty" unit="no unit" bounds={[0, 1]} />
      <QuantityField control={control} name="coefficients.k2" label="k2" unit="no unit" bounds={[-2, 2]} />
      <QuantityField control={control} name="coefficients.k2StdUnc" label="k2 standard uncertainty" unit="no unit" bounds={[0, 1]} />
      <QuantityField control={control} name="coefficients.k1k2Correlation" label="Correlation of k1 and k2" unit="−1…1" bounds={[-1, 1]} />
      <div className="grid grid-cols-2 gap-3">
        <QuantityField control={control} name="frameWidthPx" label="Frame width" unit="px" required />
        <QuantityField control={control} name="frameHeightPx" label="Frame height" unit="px" required />
      </div>
      <p className="text-micro text-ink-faint sm:col-span-2">
        The frame size the coefficients were measured at. A clip of another shape (aspect ratio) cannot use the profile: its picture is another crop of the sensor.
      </p>
      <div className="sm:col-span-2">
        <FormError error={failure?.error} hideFields={failure?.placed} />
      </div>
      <div className="flex justify-end gap-2 sm:col-span-2">
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" busy={formState.isSubmitting}>
          {profile ? 'Save changes' : 'Add lens profile'}
        </Button>
      </div>
    </form>
  );
}
