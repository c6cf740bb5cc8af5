import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import type { FitPlots } from '../hooks/use-fit-plots';
import { CHART } from './chart-colours';
import { formatNumber } from '@/lib/format';

/** Residuals (mark − fit) in millimetres against time; outliers drawn in red. */
export function ResidualChart({ plots }: { plots: FitPlots }) {
  const x = plots.withFit.map((m) => ({ tS: m.tS, mm: m.xResidualM * 1000, outlier: m.outlier }));
  const y = plots.withFit.map((m) => ({ tS: m.tS, mm: m.yResidualM * 1000, outlier: m.outlier }));
  const outliers = [...x, ...y].filter((p) => p.outlier);
  return (
    <figure aria-label="Residuals against time" data-chart="residuals">
      <ResponsiveContainer width="100%" height={220}>
        <ScatterChart margin={{ top: 8, right: 16, bottom: 24, left: 16 }}>
          <CartesianGrid stroke={CHART.grid} />
          <XAxis type="number" dataKey="tS" domain={['auto', 'auto']} tickFormatter={(v: number) => formatNumber(v, { decimals: 3 })} label={{ value: 't (s)', position: 'insideBottom', offset: -12 }} />
          <YAxis type="number" dataKey="mm" tickFormatter={(v: number) => formatNumber(v, { decimals: 1 })} width={56}
            // Centred on the axis: recharts anchors a rotated label at its start by default, which pushed "residual (mm)" out of the chart.
            label={{ value: 'residual (mm)', angle: -90, position: 'insideLeft', offset: -4, style: { textAnchor: 'middle' } }}
          />
          <ReferenceLine y={0} stroke={CHART.ink} />
          <Tooltip formatter={(v) => (typeof v === 'number' ? formatNumber(v, { decimals: 3 }) : String(v))} />
          <Legend verticalAlign="top" height={28} />
          <Scatter name="x residual" data={x} fill={CHART.marks} isAnimationActive={false} />
          <Scatter name="y residual" data={y} fill={CHART.fit} shape="diamond" isAnimationActive={false} />
          {outliers.length > 0 && <Scatter name="outlier" data={outliers} fill="none" stroke={CHART.outlier} isAnimationActive={false} />}
        </ScatterChart>
      </ResponsiveContainer>
    </figure>
  );
}
