import type { SweepRow } from '@shared/schemas/presets';
import { formatNumber } from '@/lib/format';

/** Range, apex and flight time every 5° of elevation, beside the vacuum range. */
export function SweepTable({ rows, bestDeg }: { rows: SweepRow[]; bestDeg: number }) {
  const f = (v: number | null, d = 1) => formatNumber(v, { decimals: d });
  return (
    <table className="w-full text-body tabular-nums" aria-label="Elevation sweep">
      <thead>
        <tr className="text-left text-micro text-ink-faint">
          <th className="font-medium">Elevation</th>
          <th className="font-medium">Range (m)</th>
          <th className="font-medium">Apex (m)</th>
          <th className="font-medium">Flight (s)</th>
          <th className="font-medium">Impact (m/s)</th>
          <th className="font-medium">Vacuum range (m)</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.elevationDeg} className={`border-t border-line ${Math.abs(r.elevationDeg - bestDeg) < 2.5 ? 'bg-fit-light/50' : ''}`}>
            <td>{r.elevationDeg}°</td>
            <td>{f(r.rangeM)}</td>
            <td>{f(r.apexHeightM)}</td>
            <td>{f(r.timeOfFlightS, 2)}</td>
            <td>{f(r.impactSpeedMps)}</td>
            <td className="text-vacuum">{f(r.vacuumRangeM)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
