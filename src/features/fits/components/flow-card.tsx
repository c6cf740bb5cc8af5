import { formatScientific, formatNumber } from '@/lib/format';
import type { FitShotResult } from '@shared/physics/types';
import { Card } from '@/components/ui/card';
import { KeyValueList } from '@/components/ui/key-value-list';

/** Reynolds and Mach numbers along the fitted flight, with the physics core's cautions about the model. */
export function FlowCard({ result }: { result: FitShotResult }) {
  const d = result.derived;
  return (
    <Card title="Flow regime and model checks" subtitle="Whether a constant drag coefficient is a fair description of this flight">
      <KeyValueList
        items={[
          { label: 'Reynolds number', value: `${formatScientific(d.reynoldsMin)} to ${formatScientific(d.reynoldsMax)}`, numeric: true },
          { label: 'Peak Mach number', value: formatNumber(d.machMax, { decimals: 3 }), numeric: true },
          { label: 'Drag length 1/k', value: d.dragLengthM === null ? '—' : `${formatNumber(d.dragLengthM, { decimals: 1 })} m`, numeric: true },
          { label: 'Marks flagged as outliers', value: String(result.outlierCount), numeric: true },
        ]}
      />
      {result.cautions.length > 0 ? (
        <ul className="mt-3 space-y-1 rounded-md border border-alert/40 bg-alert-light/40 px-3 py-2 text-body text-ink" aria-label="Cautions">
          {result.cautions.map((c) => (
            <li key={c}>
              <span className="font-semibold text-alert">Caution: </span>
              {c}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-3 text-micro text-ink-faint">No cautions: the flow stays below Mach 0.6 and outside the sphere drag crisis, and the fit converged.</p>
      )}
    </Card>
  );
}
