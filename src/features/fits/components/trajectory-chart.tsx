import { CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import type { FitPlots } from '../hooks/use-fit-plots';
import { CHART } from './chart-colours';
import { formatNumber } from '@/lib/format';

/** Height against downrange distance, in metres: marks, drag fit (teal) and drag-free fit (violet, dashed). */
export function TrajectoryChart({ plots }: { plots: FitPlots }) {
  const marks = plots.withFit.map((m) => ({ xM: m.xM, yM: m.yM, outlier: m.outlier }));
  return (
    <figure aria-label="Trajectory in world units" data-chart="trajectory">
      <ResponsiveContainer width="100%" height={300}>
        <ComposedChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
          <CartesianGrid stroke={CHART.grid} />
          <XAxis type="number" dataKey="xM" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 2 })} label={{ value: 'x (m)', position: 'insideBottom', offset: -12 }} />
          <YAxis type="number" dataKey="yM" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 2 })} label={{ value: 'y (m)', angle: -90, position: 'insideLeft' }} />
          <Tooltip formatter={(v) => (typeof v === 'number' ? formatNumber(v, { decimals: 4 }) : String(v))} />
          <Legend verticalAlign="top" height={28} />
          <Scatter name="marks" data={marks} fill="none" stroke={CHART.marks} isAnimationActive={false} />
          <Line name="drag fit" data={plots.curves.drag} dataKey="yM" stroke={CHART.fit} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Line name="drag-free fit" data={plots.curves.dragFree} dataKey="yM" stroke={CHART.dragFree} strokeWidth={1.5} strokeDasharray="6 4" dot={false} isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}
