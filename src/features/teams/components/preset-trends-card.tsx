import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { PresetTrend } from '@shared/schemas/work-queues';
import { Card } from '@/components/ui/card';
import { formatDate } from '@/lib/format';

const TEAL = '#1f7a72';
const INK_SOFT = '#3d4a5c';

/** Per preset, the approved drag coefficient and launcher efficiency of each approved fit, in order of approval. */
export function PresetTrendsCard({ trends }: { trends: PresetTrend[] }) {
  if (trends.length === 0) return null;
  return (
    <Card title="Approved numbers per preset" subtitle="Drag coefficient and launcher efficiency of each approved fit, oldest to newest.">
      <div className="grid gap-5 md:grid-cols-2">
        {trends.map((t) => (
          <figure key={t.presetId} aria-label={`Trend of ${t.name}`} data-chart="preset-trend">
            <figcaption className="mb-1 text-micro font-medium text-ink">{t.name}</figcaption>
            {t.points.length === 0 ? (
              <p className="text-micro text-ink-faint">No approved fits of this launcher and projectile yet.</p>
            ) : (
              <ResponsiveContainer width="100%" height={160}>
                <LineChart data={t.points.map((p) => ({ ...p, day: formatDate(p.at) }))} margin={{ top: 4, right: 8, bottom: 4, left: 0 }}>
                  <CartesianGrid stroke="#e2dccf" />
                  <XAxis dataKey="day" tick={{ fontSize: 11 }} />
                  <YAxis yAxisId="cd" domain={['auto', 'auto']} tick={{ fontSize: 11 }} width={40} />
                  <YAxis yAxisId="eff" orientation="right" domain={[0, 1]} tick={{ fontSize: 11 }} width={32} />
                  <Tooltip formatter={(v) => (typeof v === 'number' ? v.toFixed(3) : String(v))} labelFormatter={(_l, items) => items?.[0]?.payload?.shotLabel ?? ''} />
                  <Legend verticalAlign="top" height={22} wrapperStyle={{ fontSize: 11 }} />
                  <Line yAxisId="cd" name="Cd" dataKey="dragCoefficient" stroke={TEAL} strokeWidth={2} dot isAnimationActive={false} connectNulls />
                  <Line yAxisId="eff" name="launcher efficiency" dataKey="launcherEfficiency" stroke={INK_SOFT} strokeDasharray="4 3" dot isAnimationActive={false} connectNulls />
                </LineChart>
              </ResponsiveContainer>
            )}
          </figure>
        ))}
      </div>
    </Card>
  );
}
