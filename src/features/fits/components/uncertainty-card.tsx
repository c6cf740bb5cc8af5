import type { FitShotResult, UncertaintySource } from '@shared/physics/types';
import type { FitInputSnapshot } from '@shared/fits/snapshot';
import { Card } from '@/components/ui/card';
import { formatUncertainty } from '@/lib/format';

const SOURCE_COLOURS: Record<UncertaintySource, string> = {
  'marking scatter': '#d9822b',
  scale: '#1f7a72',
  mass: '#7a6fa8',
  diameter: '#3d4a5c',
  'air density': '#8fb7b2',
  lens: '#b07a3a',
  'plane offset': '#5c7f9e',
  level: '#9e5c7f',
};


function Bar({ parts, label }: { parts: { source: UncertaintySource; u: number }[]; label: string }) {
  const total = parts.reduce((s, p) => s + p.u * p.u, 0);
  return (
    <div>
      <p className="mb-1 text-micro font-medium text-ink-soft">{label}</p>
      <div className="flex h-3 overflow-hidden rounded-full bg-paper-sunk" role="img" aria-label={`${label}: share of variance by source`}>
        {total > 0 &&
          parts.map((p) => (
            <span key={p.source} style={{ width: `${(100 * p.u * p.u) / total}%`, background: SOURCE_COLOURS[p.source] }} title={`${p.source}: ${((100 * p.u * p.u) / total).toFixed(1)} %`} />
          ))}
      </div>
    </div>
  );
}

/** Where the intervals come from: each source's standard uncertainty and its share of the variance. */
export function UncertaintyCard({ result, snapshot }: { result: FitShotResult; snapshot: FitInputSnapshot }) {
  const b = result.uncertaintyBreakdown;
  const speedTotal = b.reduce((s, x) => s + x.launchSpeedMps ** 2, 0);
  const cdTotal = b.reduce((s, x) => s + x.dragCoefficient ** 2, 0);
  const notes: Record<UncertaintySource, string> = {
    'marking scatter': 'from the residuals of this fit',
    scale: snapshot.uncertainties.scaleRelative.source,
    mass: snapshot.uncertainties.massKg.source,
    diameter: snapshot.uncertainties.diameterM.source,
    'air density': snapshot.uncertainties.airDensityKgM3.source,
    lens: 'lens coefficients’ uncertainty, through every corrected pixel',
    'plane offset': 'camera-to-plane distance and reference offset tolerances',
    level: 'level-line clicks or the stated roll tolerance',
  };
  const shiftMs = (result.exposureShiftS ?? 0) * 1000;
  return (
    <Card title="Where the uncertainty comes from" subtitle="Standard uncertainties per source (first order, sources independent) and their share of the variance">
      <div className="mb-4 grid gap-3 sm:grid-cols-2">
        <Bar label="Launch speed" parts={b.map((x) => ({ source: x.source, u: x.launchSpeedMps }))} />
        <Bar label="Drag coefficient" parts={b.map((x) => ({ source: x.source, u: x.dragCoefficient }))} />
      </div>
      {shiftMs !== 0 && (
        <p className="mb-3 text-body text-ink-soft">
          Mark times moved by {shiftMs > 0 ? '+' : '−'}{Math.abs(shiftMs).toFixed(3)}&nbsp;ms to mid-exposure (from the clip’s shutter time and frame stamp).
        </p>
      )}
      <table className="w-full text-body" aria-label="Uncertainty by source">
        <thead>
          <tr className="border-b border-line text-left text-micro uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-3 font-semibold">Source</th>
            <th className="py-1 pr-3 text-right font-semibold">Speed (m/s)</th>
            <th className="py-1 pr-3 text-right font-semibold">Cd</th>
            <th className="py-1 pr-3 text-right font-semibold">Angle (°)</th>
            <th className="py-1 font-semibold">Based on</th>
          </tr>
        </thead>
        <tbody>
          {b.map((x) => (
            <tr key={x.source} className="border-b border-line/60 last:border-0">
              <th scope="row" className="py-1 pr-3 text-left font-medium">
                <span className="mr-2 inline-block size-2.5 rounded-full align-middle" style={{ background: SOURCE_COLOURS[x.source] }} />
                {x.source}
              </th>
              <td className="py-1 pr-3 text-right tabular-nums">
                {formatUncertainty(x.launchSpeedMps)} <span className="text-micro text-ink-faint">({speedTotal > 0 ? ((100 * x.launchSpeedMps ** 2) / speedTotal).toFixed(0) : 0} %)</span>
              </td>
              <td className="py-1 pr-3 text-right tabular-nums">
                {formatUncertainty(x.dragCoefficient)} <span className="text-micro text-ink-faint">({cdTotal > 0 ? ((100 * x.dragCoefficient ** 2) / cdTotal).toFixed(0) : 0} %)</span>
              </td>
              <td className="py-1 pr-3 text-right tabular-nums">{x.launchAngleDeg === undefined ? '—' : formatUncertainty(x.launchAngleDeg)}</td>
              <td className="py-1 text-micro text-ink-faint">{notes[x.source]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
