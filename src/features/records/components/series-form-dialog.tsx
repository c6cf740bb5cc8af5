import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { SeriesCreateBody, type Series } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { applyApiFieldErrors } from '@/lib/form-errors';
import { useCreateSeries } from '@/api/series/create-series';
import { useUpdateSeries } from '@/api/series/update-series';

type SeriesInput = z.input<typeof SeriesCreateBody>;
const FIELDS = ['name', 'testDate', 'site', 'notes'] as const;

export interface SeriesFormDialogProps {
  teamId: string;
  /** Site of the team, offered for a new series. */
  defaultSite?: string | null;
  /** Edits this series; creates a new one when null. */
  series: Series | null;
  open: boolean;
  onClose: () => void;
}

export function SeriesFormDialog({ teamId, defaultSite, series, open, onClose }: SeriesFormDialogProps) {
  return (
    <Dialog open={open} onClose={onClose} title={series ? `Edit ${series.name}` : 'New test series'} description="A series groups the shots of one session at one site.">
      {open && <SeriesForm key={series?.id ?? 'new'} teamId={teamId} series={series} defaultSite={defaultSite} onDone={onClose} />}
    </Dialog>
  );
}

function SeriesForm({ teamId, series, defaultSite, onDone }: { teamId: string; series: Series | null; defaultSite?: string | null; onDone: () => void }) {
  const create = useCreateSeries(teamId);
  const update = useUpdateSeries(teamId);
  const [failure, setFailure] = useState<{ error: unknown; placed: string[] } | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SeriesInput, unknown, z.output<typeof SeriesCreateBody>>({
    resolver: zodResolver(SeriesCreateBody),
    defaultValues: {
      name: series?.name ?? '',
      testDate: series?.testDate ?? new Date().toISOString().slice(0, 10),
      site: series?.site ?? defaultSite ?? '',
      notes: series?.notes ?? '',
    },
  });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      if (series) await update.mutateAsync({ id: series.id, body: values });
      else await create.mutateAsync(values);
      onDone();
    } catch (error) {
      setFailure({ error, placed: applyApiFieldErrors(error, setError, FIELDS) });
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <TextField label="Name" required placeholder="e.g. North lane — afternoon" error={formState.errors.name?.message} {...register('name')} />
      <TextField label="Test date" type="date" required error={formState.errors.testDate?.message} {...register('testDate')} />
      <TextField label="Site" error={formState.errors.site?.message} {...register('site')} />
      <TextareaField label="Notes" error={formState.errors.notes?.message} {...register('notes')} />
      <FormError error={failure?.error} hideFields={failure?.placed} />
      <div className="flex justify-end gap-2">
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" busy={formState.isSubmitting}>
          {series ? 'Save changes' : 'Create series'}
        </Button>
      </div>
    </form>
  );
}
