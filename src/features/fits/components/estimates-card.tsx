import { formatEstimate, formatEstimateInterval, formatNumber } from '@/lib/format';
import type { Estimate, FitShotResult } from '@shared/physics/types';
import type { FitInputSnapshot } from '@shared/fits/snapshot';
import { Card } from '@/components/ui/card';

/** Degrees attach to the number; other units take a space (SI Brochure §5.4.3). */
const withUnit = (text: string, unit: string) => (unit === '' ? text : unit === '°' ? `${text}°` : `${text} ${unit}`);

interface Row {
  label: string;
  unit: string;
  estimate: Estimate | null;
  /** Where this interval comes from, in words. */
  from: string;
}

/** Ballistic coefficient m / (Cd A) is monotone in Cd, so its interval is the Cd interval mapped through it. */
function ballisticCoefficient(result: FitShotResult, snapshot: FitInputSnapshot): Estimate | null {
  const cd = result.dragCoefficient;
  if (!(cd.value > 0)) return null;
  // The physics core uses the frontal area π d²/4 for Cd, so the same area here.
  const area = (Math.PI * snapshot.projectile.diameterM ** 2) / 4;
  const bc = (c: number) => snapshot.projectile.massKg / (c * area);
  const hi = cd.ci95[0] > 0 ? bc(cd.ci95[0]) : Number.POSITIVE_INFINITY;
  return { value: bc(cd.value), stdErr: (bc(cd.value) * cd.stdErr) / cd.value, ci95: [bc(cd.ci95[1]), hi] };
}

export function EstimatesCard({ result, snapshot }: { result: FitShotResult; snapshot: FitInputSnapshot }) {
  const rows: Row[] = [
    { label: 'Launch speed', unit: 'm/s', estimate: result.launchSpeedMps, from: 'marking scatter and scale' },
    { label: 'Launch angle', unit: '°', estimate: result.launchAngleDeg, from: 'marking scatter' },
    { label: 'Drag coefficient Cd', unit: '', estimate: result.dragCoefficient, from: 'marking scatter, scale, mass, diameter, air density' },
    { label: 'Drag constant k', unit: '1/m', estimate: result.dragK_perM, from: 'marking scatter and scale' },
    { label: 'Ballistic coefficient', unit: 'kg/m²', estimate: ballisticCoefficient(result, snapshot), from: 'the Cd interval, mapped through m / (Cd A)' },
  ];
  if (result.muzzle) rows.push({ label: 'Muzzle speed', unit: 'm/s', estimate: result.muzzle.speedMps, from: 'back-extrapolated to the marked muzzle: marking scatter and scale' });
  return (
    <Card title="Measured numbers" subtitle={`95 % intervals · headline model: ${result.model === 'quadratic-drag' ? 'quadratic drag' : 'drag-free'} · ${result.degreesOfFreedom} degrees of freedom`}>
      <table className="w-full text-body" aria-label="Fitted values with 95 % intervals">
        <thead>
          <tr className="border-b border-line text-left text-micro uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-3 font-semibold">Quantity</th>
            <th className="py-1 pr-3 text-right font-semibold">Value</th>
            <th className="py-1 pr-3 text-right font-semibold">95 % interval</th>
            <th className="py-1 font-semibold">Interval from</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-b border-line/60 last:border-0" data-quantity={r.label}>
              <th scope="row" className="py-1.5 pr-3 text-left font-medium text-ink">{r.label}</th>
              <td className="py-1.5 pr-3 text-right tabular-nums text-lead font-semibold text-fit-dark">
                {r.estimate ? withUnit(formatEstimate(r.estimate), r.unit) : '—'}
              </td>
              <td className="py-1.5 pr-3 text-right tabular-nums text-ink-soft">
                {r.estimate ? (Number.isFinite(r.estimate.ci95[1]) ? withUnit(formatEstimateInterval(r.estimate), r.unit) : withUnit(`above ${r.estimate.ci95[0].toFixed(2)}`, r.unit)) : 'not defined (Cd not positive)'}
              </td>
              <td className="py-1.5 text-micro text-ink-faint">{r.from}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-3 text-body text-ink">
        <span className="font-semibold">Drag: </span>
        {result.dragVerdict}.
      </p>
      <p className="text-micro text-ink-faint">
        RMS residual {formatNumber(result.rmsResidualM * 1000, { decimals: 2 })} mm · drag-free fit {formatEstimate(result.dragFree.launchSpeedMps)} m/s at {formatEstimate(result.dragFree.launchAngleDeg)}° · {result.gravityCheck ? <>gravity fitted freely in the drag model {formatEstimate(result.gravityCheck.gravityMps2)} m/s²</> : <>gravity fitted freely {formatEstimate(result.dragFree.freeGravityMps2)} m/s²</>}
      </p>
    </Card>
  );
}
