import { CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import type { FitPlots } from '../hooks/use-fit-plots';
import { CHART } from './chart-colours';
import { formatNumber } from '@/lib/format';

/** Speed against time: the fitted curves and the (noisy) speeds between consecutive marks. */
export function SpeedChart({ plots }: { plots: FitPlots }) {
  return (
    <figure aria-label="Speed against time" data-chart="speed">
      <ResponsiveContainer width="100%" height={240}>
        <ComposedChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
          <CartesianGrid stroke={CHART.grid} />
          <XAxis type="number" dataKey="tS" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 3 })} label={{ value: 't (s)', position: 'insideBottom', offset: -12 }} />
          <YAxis type="number" dataKey="speedMps" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 1 })} label={{ value: 'speed (m/s)', angle: -90, position: 'insideLeft' }} />
          <Tooltip formatter={(v) => (typeof v === 'number' ? formatNumber(v, { decimals: 3 }) : String(v))} />
          <Legend verticalAlign="top" height={28} />
          <Scatter name="between marks" data={plots.markSpeeds} fill="none" stroke={CHART.marks} isAnimationActive={false} />
          <Line name="drag fit" data={plots.curves.drag} dataKey="speedMps" stroke={CHART.fit} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Line name="drag-free fit" data={plots.curves.dragFree} dataKey="speedMps" stroke={CHART.dragFree} strokeWidth={1.5} strokeDasharray="6 4" dot={false} isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}
