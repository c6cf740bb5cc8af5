import { CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { ForecastResponse } from '@shared/schemas/presets';
import { formatNumber } from '@/lib/format';

// DEVELOPERS.md palette: fit teal for the model with drag, vacuum violet dashed without.
const COLOURS = { drag: '#1f7a72', vacuum: '#7a6fa8', grid: '#e2dccf' } as const;

export function ForecastTrajectoryChart({ forecast }: { forecast: ForecastResponse }) {
  return (
    <figure aria-label="Forecast trajectories" data-chart="forecast-trajectory">
      <ResponsiveContainer width="100%" height={320}>
        <ComposedChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
          <CartesianGrid stroke={COLOURS.grid} />
          <XAxis type="number" dataKey="xM" domain={[0, 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 0 })} label={{ value: 'downrange (m)', position: 'insideBottom', offset: -12 }} />
          <YAxis type="number" dataKey="yM" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 0 })} label={{ value: 'height (m)', angle: -90, position: 'insideLeft' }} />
          <Tooltip formatter={(v) => (typeof v === 'number' ? formatNumber(v, { decimals: 2 }) : String(v))} />
          <Legend verticalAlign="top" height={28} />
          <Line name="with drag" data={forecast.trajectories.drag} dataKey="yM" stroke={COLOURS.drag} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Line name="without drag (vacuum)" data={forecast.trajectories.vacuum} dataKey="yM" stroke={COLOURS.vacuum} strokeWidth={1.5} strokeDasharray="6 4" dot={false} isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}
