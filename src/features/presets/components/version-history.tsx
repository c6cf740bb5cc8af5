import type { PresetVersion } from '@shared/schemas/presets';
import { LAUNCHER_MODEL_LABELS } from '@shared/schemas/presets';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { formatDateTime, formatNumber } from '@/lib/format';
import { cdText, pctText } from './preset-format';
import { versionChangeCells } from './version-change';

function diffValue(v: number | string | null, field: string): string {
  if (v === null) return '—';
  if (typeof v === 'string') return v;
  if (field.startsWith('efficiency')) return pctText(v);
  return formatNumber(v, { decimals: 3 });
}

function HeterogeneityLine({ label, h }: { label: string; h: NonNullable<PresetVersion['heterogeneity']>['dragCoefficient'] }) {
  if (!h) return null;
  return (
    <p className={h.disagree ? 'text-alert' : 'text-ink-soft'}>
      <span className="font-medium">{label}:</span> {h.verdict}{' '}
      <span className="tabular-nums text-ink-faint">
        (Q = {formatNumber(h.cochranQ, { digits: 3 })}, {h.degreesOfFreedom} dof, I² = {formatNumber(h.iSquared * 100, { decimals: 0 })} %)
      </span>
    </p>
  );
}

/** Newest first: values, sources, provenance and what changed from the version before. */
export function VersionHistory({ versions, fitLabel }: { versions: PresetVersion[]; fitLabel: (fitId: string) => string }) {
  return (
    <Card title="Version history" subtitle="Versions never change once published; each keeps its sources and who published it.">
      <ol className="flex flex-col gap-4" aria-label="Versions">
        {[...versions].reverse().map((v, i) => (
          <li key={v.id} className="rounded-card border border-line bg-paper p-3" data-testid={`version-${v.version}`}>
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="text-lead font-semibold">
                Version {v.version} {i === 0 && <Badge tone="fit">current</Badge>}
              </h3>
              <p className="text-micro text-ink-faint">
                {v.publishedBy?.displayName ?? 'unknown'} · {formatDateTime(v.publishedAt)}
              </p>
            </div>
            <dl className="mt-2 grid grid-cols-1 gap-x-6 gap-y-1 text-body sm:grid-cols-2">
              <div>
                <dt className="text-micro text-ink-faint">Drag coefficient</dt>
                <dd className="tabular-nums">{cdText(v.dragCoefficient, v.dragCoefficientStd)}</dd>
                <dd className="text-micro text-ink-soft">{v.dragSource}</dd>
              </div>
              <div>
                <dt className="text-micro text-ink-faint">Launcher efficiency ({LAUNCHER_MODEL_LABELS[v.launcherModel]})</dt>
                <dd className="tabular-nums">{pctText(v.efficiency, v.efficiencyStd)}</dd>
                <dd className="text-micro text-ink-soft">{v.efficiencySource}</dd>
              </div>
              <div>
                <dt className="text-micro text-ink-faint">Keep-out safety factor</dt>
                <dd className="tabular-nums">× {formatNumber(v.keepOutSafetyFactor, { decimals: 2 })}</dd>
              </div>
              {v.note && (
                <div>
                  <dt className="text-micro text-ink-faint">Note</dt>
                  <dd>{v.note}</dd>
                </div>
              )}
            </dl>
            {v.pooledFitIds.length > 0 && (
              <p className="mt-2 text-micro text-ink-soft">Pooled fits: {v.pooledFitIds.map(fitLabel).join(', ')}</p>
            )}
            {v.heterogeneity && (
              <div className="mt-2 text-micro">
                <HeterogeneityLine label="Cd" h={v.heterogeneity.dragCoefficient} />
                <HeterogeneityLine label="Efficiency" h={v.heterogeneity.efficiency} />
              </div>
            )}
            {v.diff.fromVersion !== null && (
              <table className="mt-2 w-full text-micro" aria-label={`Changes from version ${v.diff.fromVersion}`}>
                <thead>
                  <tr className="text-left text-ink-faint">
                    <th className="font-medium">Changed from v{v.diff.fromVersion}</th>
                    <th className="font-medium">before</th>
                    <th className="font-medium">after</th>
                    <th className="font-medium">change</th>
                  </tr>
                </thead>
                <tbody>
                  {v.diff.rows.map((r) => {
                    const numeric = typeof r.after === 'number' && (r.before === null || typeof r.before === 'number');
                    const cells = numeric ? versionChangeCells(r.before as number | null, r.after as number, r.field) : { before: diffValue(r.before, r.field), after: diffValue(r.after, r.field), change: '' };
                    return (
                      <tr key={r.field} className="border-t border-line align-top">
                        <td className="pr-2">{r.label}</td>
                        <td className="pr-2 tabular-nums">{cells.before}</td>
                        <td className="pr-2 tabular-nums">{cells.after}</td>
                        <td className="tabular-nums">{cells.change}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            )}
          </li>
        ))}
      </ol>
    </Card>
  );
}
