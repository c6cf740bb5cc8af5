import type { ForecastBody, PresetSummary } from '@shared/schemas/presets';
import type { FitDetail } from '@shared/schemas/fits';
import { Card } from '@/components/ui/card';
import { errorMessage } from '@/components/ui/form-error';
import { useForecast } from '@/api/presets/get-forecast';
import { usePresets } from '@/api/presets/list-presets';
import { usePresetComparisons } from '@/api/fits/list-preset-comparisons';
import { formatNumber } from '@/lib/format';

/** The day's conditions of this shot as a forecast request, or why there is none. */
function forecastBody(fit: FitDetail, preset: PresetSummary): ForecastBody | string {
  const s = fit.snapshot.shot;
  if (s.chamberPressurePa === null || s.chamberPressurePa < 1e3) return 'needs the shot’s chamber pressure';
  const elevation = s.elevationDeg ?? fit.result.launchAngleDeg.value;
  if (!(elevation >= 1 && elevation <= 89)) return 'needs an elevation between 1° and 89°';
  return {
    presetId: preset.id,
    pressurePa: s.chamberPressurePa,
    elevationDeg: elevation,
    ...(s.airTempC !== null ? { airTempC: s.airTempC } : {}),
    ...(s.stationPressurePa !== null ? { stationPressurePa: s.stationPressurePa } : {}),
    ...(s.relativeHumidityPct !== null ? { relativeHumidityPct: s.relativeHumidityPct } : {}),
  };
}

function PresetRow({ teamId, fit, preset }: { teamId: string; fit: FitDetail; preset: PresetSummary }) {
  const body = forecastBody(fit, preset);
  const forecast = useForecast(teamId, typeof body === 'string' ? null : body);
  const measured = fit.result.muzzle?.speedMps.value ?? fit.result.launchSpeedMps.value;
  const cd = fit.result.dragCoefficient.value;
  const f = forecast.data;
  return (
    <tr className="border-b border-line/60 last:border-0">
      <th scope="row" className="py-1.5 pr-3 text-left font-medium">
        {preset.name}
        {f && <span className="block text-micro font-normal text-ink-faint">version {f.version.version}</span>}
      </th>
      {typeof body === 'string' ? (
        <td colSpan={2} className="py-1.5 text-micro text-ink-soft">Not forecast: {body}.</td>
      ) : forecast.error ? (
        <td colSpan={2} className="py-1.5 text-micro text-alert">{errorMessage(forecast.error)}</td>
      ) : !f ? (
        <td colSpan={2} className="py-1.5 text-micro text-ink-faint">Forecasting…</td>
      ) : (
        <>
          <td className="py-1.5 pr-3 text-right tabular-nums">
            {formatNumber(f.muzzleSpeedMps, { decimals: 2 })} m/s
            <span className="block text-micro text-ink-faint">measured {formatNumber(measured, { decimals: 2 })} ({(100 * (measured / f.muzzleSpeedMps - 1)).toFixed(1)} %)</span>
          </td>
          <td className="py-1.5 text-right tabular-nums">
            {formatNumber(f.version.dragCoefficient, { decimals: 3 })} ± {formatNumber(f.version.dragCoefficientStd, { decimals: 3 })}
            <span className="block text-micro text-ink-faint">measured {formatNumber(cd, { decimals: 3 })}</span>
          </td>
        </>
      )}
    </tr>
  );
}

/** Design presets of this launcher and projectile: their forecast for this shot's pressure and air, beside the measurement. */
export function PresetForecastCard({ teamId, fit }: { teamId: string; fit: FitDetail }) {
  const presets = usePresets(teamId);
  const comparisons = usePresetComparisons(teamId, fit.id);
  const matching = (presets.data ?? []).filter(
    (p) => p.latest && p.projectile.id === fit.snapshot.projectile.id && (!fit.snapshot.launcher || p.launcher.id === fit.snapshot.launcher.id),
  );
  return (
    <Card title="Against the design presets" subtitle="Each matching preset’s forecast for this shot’s chamber pressure, elevation and air">
      {presets.error && <p className="text-body text-alert">{errorMessage(presets.error)}</p>}
      {presets.data && matching.length === 0 && <p className="text-body text-ink-soft">No design preset for this launcher and projectile yet.</p>}
      {matching.length > 0 && (
        <table className="w-full text-body" aria-label="Preset forecasts">
          <thead>
            <tr className="border-b border-line text-left text-micro uppercase tracking-wide text-ink-faint">
              <th className="py-1 pr-3 font-semibold">Preset</th>
              <th className="py-1 pr-3 text-right font-semibold">Forecast muzzle speed</th>
              <th className="py-1 text-right font-semibold">Preset Cd</th>
            </tr>
          </thead>
          <tbody>
            {matching.map((p) => (
              <PresetRow key={p.id} teamId={teamId} fit={fit} preset={p} />
            ))}
          </tbody>
        </table>
      )}
      {comparisons.data && comparisons.data.length > 0 && (
        <p className="mt-2 text-micro text-ink-soft">
          This fit {comparisons.data.map((c) => `${c.role === 'pooled' ? 'went into' : 'was compared against'} ${c.presetName} version ${c.version}`).join('; ')}.
        </p>
      )}
    </Card>
  );
}
