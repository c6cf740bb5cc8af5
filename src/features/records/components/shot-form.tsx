import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { BOUNDS, ShotCreateBody, type Shot } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { applyApiFieldErrors } from '@/lib/form-errors';
import { formatDate, formatQuantity } from '@/lib/format';
import { useLaunchers } from '@/api/launchers/list-launchers';
import { useProjectiles } from '@/api/projectiles/list-projectiles';
import { useSeriesList } from '@/api/series/list-series';
import { QuantityField } from './quantity-field';

type ShotFormInput = z.input<typeof ShotCreateBody>;
export type ShotFormValues = z.output<typeof ShotCreateBody>;

const FIELD_NAMES = [
  'seriesId',
  'launcherId',
  'projectileId',
  'label',
  'chamberPressurePa',
  'elevationDeg',
  'airTempC',
  'stationPressurePa',
  'relativeHumidityPct',
  'tapeRangeM',
  'notes',
] as const satisfies readonly (keyof ShotFormInput)[];

export interface ShotFormProps {
  teamId: string;
  /** The shot being edited; a new shot when left out. */
  shot?: Shot;
  /** Preselects a series for a new shot (e.g. coming from the series list). */
  defaultSeriesId?: string;
  submitLabel: string;
  onSubmit: (values: ShotFormValues) => Promise<unknown>;
  onCancel?: () => void;
}

const emptyToNull = (v: unknown) => (v === '' || v === undefined ? null : v);

/** Shot record with its conditions. Values go to the API in SI; pressures are typed in kPa, the one pressure unit of the app. */
export function ShotForm({ teamId, shot, defaultSeriesId, submitLabel, onSubmit, onCancel }: ShotFormProps) {
  const series = useSeriesList(teamId);
  const launchers = useLaunchers(teamId);
  const projectiles = useProjectiles(teamId);
  const form = useForm<ShotFormInput, unknown, ShotFormValues>({
    resolver: zodResolver(ShotCreateBody),
    defaultValues: {
      seriesId: shot?.seriesId ?? defaultSeriesId ?? '',
      launcherId: shot?.launcherId ?? null,
      projectileId: shot?.projectileId ?? null,
      label: shot?.label ?? '',
      chamberPressurePa: shot?.chamberPressurePa ?? null,
      elevationDeg: shot?.elevationDeg ?? null,
      airTempC: shot?.airTempC ?? null,
      stationPressurePa: shot?.stationPressurePa ?? null,
      relativeHumidityPct: shot?.relativeHumidityPct ?? null,
      tapeRangeM: shot?.tapeRangeM ?? null,
      notes: shot?.notes ?? '',
    },
  });
  const { register, control, handleSubmit, setError, formState } = form;
  const [launcherId, chamberPressurePa] = useWatch({ control, name: ['launcherId', 'chamberPressurePa'] });
  const launcher = launchers.data?.find((l) => l.id === launcherId);
  const overPressure =
    launcher?.maxWorkingPressurePa != null && typeof chamberPressurePa === 'number' && chamberPressurePa > launcher.maxWorkingPressurePa;

  const [submitError, setSubmitError] = useState<{ error: unknown; placed: string[] } | null>(null);
  const submit = handleSubmit(async (values) => {
    setSubmitError(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setSubmitError({ error, placed: applyApiFieldErrors(error, setError, FIELD_NAMES) });
    }
  });
  const seriesError = formState.errors.seriesId ? 'Choose the test series this shot belongs to' : undefined;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lead font-semibold">Shot</legend>
        <SelectField
          label="Test series"
          required
          placeholder="Choose a series…"
          options={(series.data ?? []).map((s) => ({ value: s.id, label: `${s.name} (${formatDate(s.testDate)})` }))}
          error={seriesError}
          {...register('seriesId')}
        />
        <TextField label="Label" required hint="How the team calls this shot, e.g. “LT40-07”." error={formState.errors.label?.message} {...register('label')} />
        <SelectField
          label="Launcher"
          placeholder="Not recorded"
          options={(launchers.data ?? []).map((l) => ({ value: l.id, label: l.name }))}
          error={formState.errors.launcherId?.message}
          {...register('launcherId', { setValueAs: emptyToNull })}
        />
        <SelectField
          label="Projectile"
          placeholder="Not recorded"
          options={(projectiles.data ?? []).map((p) => ({ value: p.id, label: `${p.name} (${formatQuantity(p.massKg * 1000, 'g', { digits: 3 })})` }))}
          error={formState.errors.projectileId?.message}
          {...register('projectileId', { setValueAs: emptyToNull })}
        />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-lead font-semibold">Launch settings</legend>
        <QuantityField
          control={control}
          name="chamberPressurePa"
          label="Chamber pressure"
          unit="kPa"
          scale={1000}
          bounds={BOUNDS.chamberPressurePa}
          hint="Gauge reading at the moment of firing."
        />
        <QuantityField control={control} name="elevationDeg" label="Elevation setting" unit="°" bounds={BOUNDS.elevationDeg} hint="Above level; the fit measures the real launch angle." />
        <QuantityField control={control} name="tapeRangeM" label="Tape-measured range" unit="m" bounds={BOUNDS.tapeRangeM} hint="Optional: where it landed." />
        {overPressure && (
          <p role="alert" className="rounded-md border-2 border-alert bg-alert-light/60 px-3 py-2 text-body text-alert sm:col-span-3">
            This pressure is above the {launcher!.name}’s rated maximum working pressure of {formatQuantity(launcher!.maxWorkingPressurePa! / 1000, 'kPa', { digits: 4 })}.
            Do not fill a vessel beyond its rating; check the record and the launcher’s documentation.
          </p>
        )}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-1 text-lead font-semibold">Air at the launcher</legend>
        <p className="-mt-1 text-micro text-ink-faint sm:col-span-3">Stored as given; air density for the drag fit is derived from these later.</p>
        <QuantityField control={control} name="airTempC" label="Air temperature" unit="°C" bounds={BOUNDS.airTempC} />
        <QuantityField
          control={control}
          name="stationPressurePa"
          label="Station pressure"
          unit="kPa"
          scale={1000}
          bounds={BOUNDS.stationPressurePa}
          hint="Barometer at the site, not corrected to sea level."
        />
        <QuantityField control={control} name="relativeHumidityPct" label="Relative humidity" unit="%" bounds={BOUNDS.relativeHumidityPct} />
      </fieldset>

      <TextareaField label="Notes" rows={3} error={formState.errors.notes?.message} {...register('notes')} />
      <FormError error={submitError?.error} hideFields={submitError?.placed} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={formState.isSubmitting}>
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
