import { compareWithLauncherModels } from '@shared/fits/launcher-efficiency';
import type { FitInputSnapshot } from '@shared/fits/snapshot';
import type { FitShotResult } from '@shared/physics/types';
import { Card } from '@/components/ui/card';
import { formatNumber } from '@/lib/format';

/** The measured speed against both launcher models, from the launcher record and the shot's chamber pressure. */
export function LauncherCard({ result, snapshot }: { result: FitShotResult; snapshot: FitInputSnapshot }) {
  const c = compareWithLauncherModels(result, snapshot);
  return (
    <Card title="Launcher efficiency" subtitle={`Energy efficiency (v measured / v model)² · measured at the ${c.measuredFrom}: ${formatNumber(c.measuredSpeedMps, { decimals: 2 })} m/s`}>
      {c.rows.length === 0 ? (
        <p className="text-body text-ink-soft">Not computed: missing {c.missing.join(', ')}. Add them to the launcher and shot records and run the fit again.</p>
      ) : (
        <table className="w-full text-body" aria-label="Launcher models">
          <thead>
            <tr className="border-b border-line text-left text-micro uppercase tracking-wide text-ink-faint">
              <th className="py-1 pr-3 font-semibold">Model</th>
              <th className="py-1 pr-3 text-right font-semibold">Model speed</th>
              <th className="py-1 text-right font-semibold">Efficiency</th>
            </tr>
          </thead>
          <tbody>
            {c.rows.map((r) => (
              <tr key={r.model} className="border-b border-line/60 last:border-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-medium">
                  {r.label}
                  {r.note && <span className="block text-micro font-normal text-ink-faint">{r.note}</span>}
                </th>
                <td className="py-1.5 pr-3 text-right tabular-nums">{r.modelSpeedMps === null ? '—' : `${formatNumber(r.modelSpeedMps, { decimals: 2 })} m/s`}</td>
                <td className="py-1.5 text-right tabular-nums font-semibold">{r.efficiency === null ? '—' : `${formatNumber(r.efficiency * 100, { decimals: 1 })} %`}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p className="mt-2 text-micro text-ink-faint">Both models ignore friction, leakage and valve losses; the efficiency absorbs them. Chamber pressure {snapshot.shot.chamberPressurePa === null ? 'not recorded' : `${formatNumber(snapshot.shot.chamberPressurePa / 1000, { decimals: 0 })} kPa gauge`}.</p>
    </Card>
  );
}
