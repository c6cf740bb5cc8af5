import { CAN } from '@shared/roles';
import { Button } from '@/components/ui/button';
import { InlineStatus } from '@/components/ui/inline-status';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useRecordComparisons } from '@/api/presets/record-comparisons';
import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { LoadingBlock } from '@/components/ui/spinner';
import { useMeasuredVsForecast } from '@/api/presets/measured-vs-forecast';
import { formatNumber } from '@/lib/format';
import { parityDomain } from './parity-domain';

const COLOURS = { speed: '#1f7a72', range: '#d9822b', grid: '#e2dccf', ink: '#3d4a5c' } as const;

function Parity({ title, unit, points, colour }: { title: string; unit: string; points: { forecast: number; measured: number; label: string }[]; colour: string }) {
  const [min, max] = parityDomain(points);
  const span = max - min;
  const tickDecimals = span >= 20 ? 0 : span >= 2 ? 1 : 2;
  return (
    <figure aria-label={title} className="min-w-0 flex-1">
      <figcaption className="mb-1 text-micro text-ink-faint">{title} — on the diagonal, the forecast matched</figcaption>
      <ResponsiveContainer width="100%" height={260}>
        <ScatterChart margin={{ top: 8, right: 16, bottom: 24, left: 16 }}>
          <CartesianGrid stroke={COLOURS.grid} />
          <XAxis type="number" dataKey="forecast" domain={[min, max]} allowDataOverflow tickFormatter={(v: number) => formatNumber(v, { decimals: tickDecimals })} label={{ value: `forecast (${unit})`, position: 'insideBottom', offset: -12 }} />
          <YAxis type="number" dataKey="measured" domain={[min, max]} allowDataOverflow tickFormatter={(v: number) => formatNumber(v, { decimals: tickDecimals })} width={56} label={{ value: `measured (${unit})`, angle: -90, position: 'insideLeft', offset: -4, style: { textAnchor: 'middle' } }} />
          <Tooltip formatter={(v) => (typeof v === 'number' ? formatNumber(v, { decimals: 2 }) : String(v))} />
          <Legend verticalAlign="top" height={24} />
          <ReferenceLine segment={[{ x: min, y: min }, { x: max, y: max }]} stroke={COLOURS.ink} strokeDasharray="4 4" />
          <Scatter name={title} data={points} fill={colour} isAnimationActive={false} />
        </ScatterChart>
      </ResponsiveContainer>
    </figure>
  );
}

/** Each approved shot of this launcher and projectile: what it did against what the preset says it should have done. */
export function MeasuredVsForecastChart({ teamId, presetId, version }: { teamId: string; presetId: string; version?: number }) {
  const q = useMeasuredVsForecast(teamId, presetId, version);
  const { can } = useCurrentTeam();
  const record = useRecordComparisons(teamId, presetId);
  const rows = q.data?.rows ?? [];
  const speeds = rows.filter((r) => r.forecastSpeedMps !== null).map((r) => ({ forecast: r.forecastSpeedMps!, measured: r.measuredSpeedMps, label: r.shotLabel }));
  const ranges = rows.filter((r) => r.forecastRangeM !== null && r.tapeRangeM !== null).map((r) => ({ forecast: r.forecastRangeM!, measured: r.tapeRangeM!, label: r.shotLabel }));
  return (
    <Card title="Measured against forecast" subtitle={q.data ? `Forecast by version ${q.data.version} at each shot’s own pressure, elevation and air` : undefined}>
      <FormError error={q.error ?? record.error} />
      {q.data && rows.length > 0 && can(CAN.review) && (
        <div className="mb-3 flex flex-wrap items-center gap-3">
          <Button size="sm" busy={record.isPending} onClick={() => record.mutate({ version: q.data.version, fitIds: rows.map((r) => r.fitId) })}>
            Record these shots as compared against version {q.data.version}
          </Button>
          {record.isSuccess && <InlineStatus tone="ok">Recorded: each fit now remembers version {record.data.version}.</InlineStatus>}
        </div>
      )}
      {q.isLoading && <LoadingBlock />}
      {q.data && rows.length === 0 && <p className="text-body text-ink-soft">No approved shots of this launcher and projectile yet.</p>}
      {rows.length > 0 && (
        <>
          <div className="flex flex-col gap-4 md:flex-row">
            <Parity title="Launch speed" unit="m/s" points={speeds} colour={COLOURS.speed} />
            <Parity title="Tape range" unit="m" points={ranges} colour={COLOURS.range} />
          </div>
          <table className="mt-3 w-full text-micro" aria-label="Measured and forecast per shot">
            <thead>
              <tr className="text-left text-ink-faint">
                <th className="font-medium">Shot</th>
                <th className="font-medium">speed measured / forecast (m/s)</th>
                <th className="font-medium">range tape / forecast (m)</th>
                <th className="font-medium">note</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.fitId} className="border-t border-line tabular-nums">
                  <td>{r.shotLabel}</td>
                  <td>
                    {formatNumber(r.measuredSpeedMps, { decimals: 2 })} ({r.measuredFrom}) / {formatNumber(r.forecastSpeedMps, { decimals: 2 })}
                  </td>
                  <td>
                    {formatNumber(r.tapeRangeM, { decimals: 1 })} / {formatNumber(r.forecastRangeM, { decimals: 1 })}
                  </td>
                  <td className="text-ink-faint">{r.note ?? ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </Card>
  );
}
