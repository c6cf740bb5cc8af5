import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router';
import type { ForecastBody, ForecastResponse } from '@shared/schemas/presets';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/select-field';
import { LoadingBlock } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { formatNumber, formatRange } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useForecast } from '@/api/presets/get-forecast';
import { usePreset } from '@/api/presets/get-preset';
import { usePresets } from '@/api/presets/list-presets';
import { ForecastTrajectoryChart } from './forecast-trajectory-chart';
import { KeepOutPanel } from './keep-out-panel';
import { KeepOutSafety } from './keep-out-safety';
import { cdText, metres, pctText } from './preset-format';
import { SweepTable } from './sweep-table';

interface FormState {
  version: string;
  pressureKPa: string;
  elevationDeg: string;
  airTempC: string;
  stationPressureKPa: string;
  relativeHumidityPct: string;
  targetHeightM: string;
  windMps: string;
}

const DEFAULT_FORM: FormState = { version: '', pressureKPa: '', elevationDeg: '30', airTempC: '15', stationPressureKPa: '101.325', relativeHumidityPct: '50', targetHeightM: '0', windMps: '0' };

function toBody(presetId: string, f: FormState): ForecastBody {
  return {
    presetId,
    version: f.version ? Number(f.version) : undefined,
    pressurePa: Number(f.pressureKPa) * 1000,
    elevationDeg: Number(f.elevationDeg),
    airTempC: Number(f.airTempC),
    stationPressurePa: Number(f.stationPressureKPa) * 1000,
    relativeHumidityPct: Number(f.relativeHumidityPct),
    targetHeightM: Number(f.targetHeightM),
    windMps: Number(f.windMps),
  };
}

// As many decimals as the band's width needs, so a narrow band never reads "23.5–23.5".
const band = (b: { low: number; high: number } | null, unit: string, d = 1) => (b ? formatRange(b.low, b.high, unit, d) : '—');

function Results({ f }: { f: ForecastResponse }) {
  const num = (v: number | null, unit: string, d = 1, id?: string) => (
    <span data-testid={id}>{v === null ? '—' : `${formatNumber(v, { decimals: d })}\u00a0${unit}`}</span>
  );
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card title="Forecast" subtitle={`${f.preset.name}, version ${f.version.version}: Cd ${cdText(f.version.dragCoefficient, f.version.dragCoefficientStd)}, efficiency ${pctText(f.version.efficiency, f.version.efficiencyStd)}`}>
        {f.cautions.length > 0 && (
          <ul className="mb-2 list-disc pl-5 text-body text-alert">
            {f.cautions.map((c) => <li key={c}>{c}</li>)}
          </ul>
        )}
        <KeyValueList
          items={[
            { label: 'Launcher model speed', value: num(f.modelSpeedMps, 'm/s'), numeric: true },
            { label: 'Muzzle speed (model × √efficiency)', value: num(f.muzzleSpeedMps, 'm/s', 2, 'forecast-muzzle-speed'), numeric: true },
            { label: 'Range with drag', value: num(f.withDrag.rangeM, 'm', 1, 'forecast-range'), numeric: true },
            { label: 'Range without drag', value: num(f.vacuum.rangeM, 'm'), numeric: true },
            { label: 'Apex with drag', value: num(f.withDrag.apexHeightM, 'm'), numeric: true },
            { label: 'Time of flight', value: num(f.withDrag.timeOfFlightS, 's', 2), numeric: true },
            { label: 'Impact speed', value: num(f.withDrag.impactSpeedMps, 'm/s'), numeric: true },
            { label: 'Impact angle below horizontal', value: num(f.withDrag.impactAngleDeg, '°'), numeric: true },
            { label: 'Best elevation with drag', value: <span data-testid="forecast-best-elevation">{`${formatNumber(f.bestElevation.angleDeg, { decimals: 1 })}° → ${metres(f.bestElevation.rangeM)}`}</span>, numeric: true },
            { label: 'Best elevation in vacuum', value: `45° → ${metres(f.bestElevation.vacuumRangeM)}`, numeric: true },
            { label: 'Air density', value: `${formatNumber(f.air.densityKgM3, { decimals: 3 })} kg/m³`, numeric: true },
          ]}
        />
      </Card>
      <Card title="Uncertainty band" subtitle="From the preset’s Cd and efficiency intervals (95 %)">
        <KeyValueList
          items={[
            { label: 'Muzzle speed', value: band(f.band.muzzleSpeedMps, 'm/s'), numeric: true },
            { label: 'Range', value: <span data-testid="forecast-range-band">{band(f.band.rangeM, 'm')}</span>, numeric: true },
            { label: 'Apex', value: band(f.band.apexHeightM, 'm'), numeric: true },
            { label: 'Time of flight', value: band(f.band.timeOfFlightS, 's', 2), numeric: true },
          ]}
        />
        <p className="mt-2 text-micro text-ink-faint">{f.band.method}</p>
      </Card>
      <Card title="Trajectories" className="lg:col-span-2">
        <ForecastTrajectoryChart forecast={f} />
      </Card>
      <Card title="Elevation sweep" subtitle="Level ground unless a target height is set; the row nearest the best elevation is shaded" className="lg:col-span-2">
        <SweepTable rows={f.sweep} bestDeg={f.bestElevation.angleDeg} />
      </Card>
    </div>
  );
}

/** Choose a preset, version, pressure, elevation and the day's air; read speed, range, apex and their band. */
export function ForecastPage() {
  const { teamId } = useCurrentTeam();
  const [params, setParams] = useSearchParams();
  const presets = usePresets(teamId);
  const presetId = params.get('preset') ?? presets.data?.[0]?.id ?? '';
  const preset = usePreset(teamId, presetId);
  const [form, setForm] = useState<FormState>(DEFAULT_FORM);
  const [applied, setApplied] = useState<ForecastBody | null>(null);

  // A new preset starts at the middle of its pressure range.
  useEffect(() => {
    if (!preset.data) return;
    const mid = (preset.data.pressureMinPa + preset.data.pressureMaxPa) / 2 / 1000;
    const next = { ...form, version: '', pressureKPa: String(Math.round(mid)) };
    setForm(next);
    setApplied(toBody(preset.data.id, next));
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the preset changes
  }, [preset.data?.id]);

  const forecast = useForecast(teamId, applied, { keepPrevious: true });
  const set = (k: keyof FormState) => (e: { target: { value: string } }) => setForm((f) => ({ ...f, [k]: e.target.value }));

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Forecast" subtitle="What a preset says the next shot will do, with drag and without, and how sure it is." />
      <KeepOutSafety />
      <Card title="Shot">
        <form
          className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4"
          onSubmit={(e) => {
            e.preventDefault();
            if (presetId) setApplied(toBody(presetId, form));
          }}
        >
          <SelectField
            label="Preset"
            value={presetId}
            onChange={(e) => setParams({ preset: e.target.value })}
            options={(presets.data ?? []).map((p) => ({ value: p.id, label: p.name }))}
            placeholder={presets.data?.length ? undefined : 'No presets yet'}
          />
          <SelectField
            label="Version"
            value={form.version}
            onChange={set('version')}
            options={[{ value: '', label: 'Latest' }, ...[...(preset.data?.versions ?? [])].reverse().map((v) => ({ value: String(v.version), label: `Version ${v.version}` }))]}
          />
          <TextField label="Chamber pressure (gauge)" type="number" step="any" suffix="kPa" value={form.pressureKPa} onChange={set('pressureKPa')} />
          <TextField label="Elevation" type="number" step="any" suffix="°" value={form.elevationDeg} onChange={set('elevationDeg')} />
          <TextField label="Air temperature" type="number" step="any" suffix="°C" value={form.airTempC} onChange={set('airTempC')} />
          <TextField label="Station pressure" type="number" step="any" suffix="kPa" value={form.stationPressureKPa} onChange={set('stationPressureKPa')} />
          <TextField label="Relative humidity" type="number" step="any" suffix="%" value={form.relativeHumidityPct} onChange={set('relativeHumidityPct')} />
          <TextField label="Target height" type="number" step="any" suffix="m" value={form.targetHeightM} onChange={set('targetHeightM')} />
          <TextField label="Wind along the line of fire" type="number" step="any" suffix="m/s" hint="Positive with the shot" value={form.windMps} onChange={set('windMps')} />
          <div className="flex items-end">
            <Button type="submit" variant="primary" busy={forecast.isFetching} disabled={!presetId}>
              Forecast
            </Button>
          </div>
        </form>
      </Card>
      <FormError error={presets.error ?? preset.error ?? forecast.error} />
      {forecast.isLoading && <LoadingBlock label="Forecasting…" />}
      {forecast.data && <Results f={forecast.data} />}
      {presetId && <KeepOutPanel teamId={teamId} presetId={presetId} version={applied?.version} />}
    </div>
  );
}
