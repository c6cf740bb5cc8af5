import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm, type FieldValues, type Path, type UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { BOUNDS, LauncherCreateBody, ProjectileCreateBody, type Launcher, type Projectile } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { applyApiFieldErrors } from '@/lib/form-errors';
import { useCreateLauncher } from '@/api/launchers/create-launcher';
import { useCreateProjectile } from '@/api/projectiles/create-projectile';
import { useUpdateLauncher } from '@/api/launchers/update-launcher';
import { useUpdateProjectile } from '@/api/projectiles/update-projectile';
import { QuantityField } from './quantity-field';

// Launchers and projectiles are typed in workshop units (mm, L, g, kPa) and stored in SI.

function useSubmitFailure<T extends FieldValues>(setError: UseFormSetError<T>, fields: readonly Path<T>[]) {
  const [failure, setFailure] = useState<{ error: unknown; placed: string[] } | null>(null);
  return {
    failure,
    run: async (action: () => Promise<unknown>) => {
      setFailure(null);
      try {
        await action();
        return true;
      } catch (error) {
        setFailure({ error, placed: applyApiFieldErrors(error, setError, fields) });
        return false;
      }
    },
  };
}

function FormButtons({ busy, editing, onCancel, noun }: { busy: boolean; editing: boolean; onCancel: () => void; noun: string }) {
  return (
    <div className="flex justify-end gap-2 sm:col-span-2">
      <Button variant="ghost" onClick={onCancel}>
        Cancel
      </Button>
      <Button type="submit" variant="primary" busy={busy}>
        {editing ? 'Save changes' : `Add ${noun}`}
      </Button>
    </div>
  );
}

function KitDialog({ open, onClose, title, children }: { open: boolean; onClose: () => void; title: string; children: ReactNode }) {
  return (
    <Dialog open={open} onClose={onClose} title={title} size="lg">
      {open && children}
    </Dialog>
  );
}

type LauncherInput = z.input<typeof LauncherCreateBody>;
const LAUNCHER_FIELDS = ['name', 'kind', 'boreM', 'barrelLengthM', 'chamberVolumeM3', 'maxWorkingPressurePa', 'valveType', 'notes'] as const;

export function LauncherFormDialog({ teamId, launcher, open, onClose }: { teamId: string; launcher: Launcher | null; open: boolean; onClose: () => void }) {
  return (
    <KitDialog open={open} onClose={onClose} title={launcher ? `Edit ${launcher.name}` : 'New launcher'}>
      <LauncherForm key={launcher?.id ?? 'new'} teamId={teamId} launcher={launcher} onDone={onClose} />
    </KitDialog>
  );
}

function LauncherForm({ teamId, launcher, onDone }: { teamId: string; launcher: Launcher | null; onDone: () => void }) {
  const create = useCreateLauncher(teamId);
  const update = useUpdateLauncher(teamId);
  const { register, control, handleSubmit, setError, formState } = useForm<LauncherInput, unknown, z.output<typeof LauncherCreateBody>>({
    resolver: zodResolver(LauncherCreateBody),
    defaultValues: {
      name: launcher?.name ?? '',
      kind: launcher?.kind ?? '',
      boreM: launcher?.boreM ?? null,
      barrelLengthM: launcher?.barrelLengthM ?? null,
      chamberVolumeM3: launcher?.chamberVolumeM3 ?? null,
      maxWorkingPressurePa: launcher?.maxWorkingPressurePa ?? null,
      valveType: launcher?.valveType ?? '',
      notes: launcher?.notes ?? '',
    },
  });
  const { failure, run } = useSubmitFailure(setError, LAUNCHER_FIELDS);
  const submit = handleSubmit(async (values) => {
    const ok = await run(() => (launcher ? update.mutateAsync({ id: launcher.id, body: values }) : create.mutateAsync(values)));
    if (ok) onDone();
  });
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" required error={formState.errors.name?.message} {...register('name')} />
      <TextField label="Kind" placeholder="e.g. compressed-air line thrower" error={formState.errors.kind?.message} {...register('kind')} />
      <QuantityField control={control} name="boreM" label="Bore" unit="mm" scale={0.001} bounds={[0, 1]} />
      <QuantityField control={control} name="barrelLengthM" label="Barrel length" unit="m" bounds={[0, 20]} />
      <QuantityField control={control} name="chamberVolumeM3" label="Chamber volume" unit="L" scale={0.001} bounds={[0, 1]} />
      <QuantityField
        control={control}
        name="maxWorkingPressurePa"
        label="Max working pressure"
        unit="kPa"
        scale={1000}
        bounds={BOUNDS.chamberPressurePa}
        hint="As rated by the maker or the vessel’s certificate; never exceed it."
      />
      <TextField label="Valve" placeholder="e.g. diaphragm" error={formState.errors.valveType?.message} {...register('valveType')} />
      <TextareaField label="Notes" fieldClassName="sm:col-span-2" error={formState.errors.notes?.message} {...register('notes')} />
      <div className="sm:col-span-2">
        <FormError error={failure?.error} hideFields={failure?.placed} />
      </div>
      <FormButtons busy={formState.isSubmitting} editing={!!launcher} onCancel={onDone} noun="launcher" />
    </form>
  );
}

type ProjectileInput = z.input<typeof ProjectileCreateBody>;
const PROJECTILE_FIELDS = ['name', 'massKg', 'diameterM', 'shape', 'referenceAreaM2', 'notes'] as const;

export function ProjectileFormDialog({ teamId, projectile, open, onClose }: { teamId: string; projectile: Projectile | null; open: boolean; onClose: () => void }) {
  return (
    <KitDialog open={open} onClose={onClose} title={projectile ? `Edit ${projectile.name}` : 'New projectile'}>
      <ProjectileForm key={projectile?.id ?? 'new'} teamId={teamId} projectile={projectile} onDone={onClose} />
    </KitDialog>
  );
}

function ProjectileForm({ teamId, projectile, onDone }: { teamId: string; projectile: Projectile | null; onDone: () => void }) {
  const create = useCreateProjectile(teamId);
  const update = useUpdateProjectile(teamId);
  const { register, control, handleSubmit, setError, formState } = useForm<ProjectileInput, unknown, z.output<typeof ProjectileCreateBody>>({
    resolver: zodResolver(ProjectileCreateBody),
    defaultValues: {
      name: projectile?.name ?? '',
      massKg: projectile?.massKg ?? (null as unknown as number),
      diameterM: projectile?.diameterM ?? (null as unknown as number),
      shape: projectile?.shape ?? '',
      referenceAreaM2: projectile?.referenceAreaM2 ?? null,
      notes: projectile?.notes ?? '',
    },
  });
  const { failure, run } = useSubmitFailure(setError, PROJECTILE_FIELDS);
  const submit = handleSubmit(async (values) => {
    const ok = await run(() => (projectile ? update.mutateAsync({ id: projectile.id, body: values }) : create.mutateAsync(values)));
    if (ok) onDone();
  });
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2">
      <TextField label="Name" required error={formState.errors.name?.message} {...register('name')} />
      <TextField label="Shape" placeholder="e.g. sphere, blunt cylinder" error={formState.errors.shape?.message} {...register('shape')} />
      <QuantityField control={control} name="massKg" label="Mass" unit="g" scale={0.001} bounds={[0, 100]} required />
      <QuantityField control={control} name="diameterM" label="Diameter" unit="mm" scale={0.001} bounds={[0, 1]} required />
      <QuantityField
        control={control}
        name="referenceAreaM2"
        label="Reference area"
        unit="cm²"
        scale={1e-4}
        bounds={[0, 1]}
        hint="Area the drag coefficient refers to; left empty, π d²/4 is used."
      />
      <TextareaField label="Notes" fieldClassName="sm:col-span-2" error={formState.errors.notes?.message} {...register('notes')} />
      <div className="sm:col-span-2">
        <FormError error={failure?.error} hideFields={failure?.placed} />
      </div>
      <FormButtons busy={formState.isSubmitting} editing={!!projectile} onCancel={onDone} noun="projectile" />
    </form>
  );
}
