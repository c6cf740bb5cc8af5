import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z as zod } from 'zod';
import { WindInput } from '@shared/schemas/camera';
import { BOUNDS, ShotCreateBody, StatedAirDensity, type Shot } from '@shared/schemas/records';
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

const orNull = <T extends zod.ZodType>(schema: T) => schema.nullish().transform((v) => v ?? null);

/**
 * The shot body with wind and a stated air density as flat fields, one input
 * each; they become the API's `wind` and `airDensity` objects (null when empty).
 */
const ShotFormSchema = ShotCreateBody.omit({ wind: true, airDensity: true })
  .extend({
    windSpeedMps: orNull(WindInput.shape.speedMps),
    windFromDeg: orNull(WindInput.shape.fromDeg),
    airDensityKgM3: orNull(StatedAirDensity.shape.densityKgM3),
    airDensityTolKgM3: orNull(zod.number({ error: 'must be a number' }).refine((v) => Number.isFinite(v) && v >= 0 && v <= 0.5, 'must be between 0 and 0.5 kg/m³')),
  })
  .superRefine((v, ctx) => {
    if ((v.windSpeedMps === null) !== (v.windFromDeg === null)) {
      const missing = v.windSpeedMps === null ? 'windSpeedMps' : 'windFromDeg';
      ctx.addIssue({ code: 'custom', path: [missing], message: 'give the wind’s speed and direction together (or neither)' });
    }
    if (v.airDensityKgM3 === null && v.airDensityTolKgM3 !== null) {
      ctx.addIssue({ code: 'custom', path: ['airDensityKgM3'], message: 'give the density its tolerance belongs to' });
    }
  })
  .transform(({ windSpeedMps, windFromDeg, airDensityKgM3, airDensityTolKgM3, ...rest }) => ({
    ...rest,
    wind: windSpeedMps !== null && windFromDeg !== null ? { speedMps: windSpeedMps, fromDeg: windFromDeg } : null,
    airDensity: airDensityKgM3 !== null ? { densityKgM3: airDensityKgM3, tolKgM3: airDensityTolKgM3 } : null,
  }));

type ShotFormInput = zod.input<typeof ShotFormSchema>;
export type ShotFormValues = zod.output<typeof ShotFormSchema>;

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
  'launchHeightM',
  'windSpeedMps',
  'windFromDeg',
  'airDensityKgM3',
  'airDensityTolKgM3',
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
    resolver: zodResolver(ShotFormSchema),
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
      launchHeightM: shot?.launchHeightM ?? null,
      windSpeedMps: shot?.wind?.speedMps ?? null,
      windFromDeg: shot?.wind?.fromDeg ?? null,
      airDensityKgM3: shot?.airDensity?.densityKgM3 ?? null,
      airDensityTolKgM3: shot?.airDensity?.tolKgM3 ?? null,
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
        <QuantityField control={control} name="launchHeightM" label="Launch height" unit="m" bounds={BOUNDS.launchHeightM} hint="Launch point above the ground." />
        {overPressure && (
          <p role="alert" className="rounded-md border-2 border-alert bg-alert-light/60 px-3 py-2 text-body text-alert sm:col-span-3">
            This pressure is above the {launcher!.name}’s rated maximum working pressure of {formatQuantity(launcher!.maxWorkingPressurePa! / 1000, 'kPa', { digits: 4 })}.
            Do not fill a vessel beyond its rating; check the record and the launcher’s documentation.
          </p>
        )}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-1 text-lead font-semibold">Air at the launcher</legend>
        <p className="-mt-1 text-micro text-ink-faint sm:col-span-3">Stored as given; air density for the drag fit is derived from these later, unless you state it below.</p>
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
        <QuantityField
          control={control}
          name="airDensityKgM3"
          label="Air density, if known"
          unit="kg/m³"
          bounds={BOUNDS.airDensityKgM3}
          hint="Stated directly, it is used instead of temperature, pressure and humidity."
        />
        <QuantityField control={control} name="airDensityTolKgM3" label="Its tolerance ±" unit="kg/m³" bounds={[0, 0.5]} hint="Empty: ±1 % is assumed." />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-1 text-lead font-semibold">Wind at the launcher</legend>
        <p className="-mt-1 text-micro text-ink-faint sm:col-span-3">
          Direction the wind blows from, clockwise from the line of fire seen from above: 0° headwind, 90° from the right, 180° tailwind, 270° from the left.
          The fit uses the part along the line of fire.
        </p>
        <QuantityField control={control} name="windSpeedMps" label="Wind speed" unit="m/s" bounds={[0, 60]} />
        <QuantityField control={control} name="windFromDeg" label="Wind from" unit="°" bounds={[0, 359.999]} hint="0 up to 360, clockwise from the line of fire." />
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
