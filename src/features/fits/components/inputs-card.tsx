import type { FitDetail } from '@shared/schemas/fits';
import { Card } from '@/components/ui/card';
import { KeyValueList } from '@/components/ui/key-value-list';
import { formatNumber, formatPressure } from '@/lib/format';
import { markCountsLine } from './mark-counts';

const orDash = (v: number | null, digits: number, unit: string) => (v === null ? '—' : `${formatNumber(v, { decimals: digits })} ${unit}`);

/** What the fit was run on, from its snapshot: a reviewer can trace every number. */
export function InputsCard({ fit }: { fit: FitDetail }) {
  const s = fit.snapshot;
  const m = s.marks;
  const how = markCountsLine(s.markCounts);
  return (
    <Card title="Inputs" subtitle={`Stored with the fit · input hash ${fit.inputHash.slice(0, 12)}…`}>
      <KeyValueList
        items={[
          { label: 'Projectile', value: `${s.projectile.name}: ${formatNumber(s.projectile.massKg * 1000, { decimals: 1 })} g, ${formatNumber(s.projectile.diameterM * 1000, { decimals: 1 })} mm` },
          { label: 'Air density', value: `${formatNumber(s.air.densityKgM3, { decimals: 4 })} kg/m³`, numeric: true },
          { label: 'Air density from', value: <span className="text-micro">{s.air.source}</span> },
          { label: 'Conditions', value: `${orDash(s.shot.airTempC, 1, '°C')}, ${formatPressure(s.shot.stationPressurePa)}, ${orDash(s.shot.relativeHumidityPct, 0, '%RH')}` },
          { label: 'Calibration', value: `version ${s.calibration.version} · ${formatNumber(s.calibration.pixelsPerMetre, { decimals: 2 })} px/m · scale ±${((s.calibration.scaleRelUncertainty ?? 0) * 100).toFixed(2)} %` },
          { label: 'Marks', value: `${m.length} marks, ${m[0]?.tS.toFixed(4)} s to ${m[m.length - 1]?.tS.toFixed(4)} s (track revision ${s.track.marksRevision})` },
          ...(how ? [{ label: 'How marked', value: how }] : []),
          { label: 'Muzzle', value: s.muzzle ? `x ${formatNumber(s.muzzle.xM, { decimals: 3 })} m, y ${formatNumber(s.muzzle.yM, { decimals: 3 })} m` : 'not marked' },
          { label: 'Frame rate', value: s.clip.frameRateHz ? `${s.clip.frameRateHz} fps` : '—', numeric: true },
          ...(s.clip.shutterS != null
            ? [{ label: 'Exposure', value: `${formatNumber(s.clip.shutterS * 1000, { decimals: 3 })} ms shutter, frames stamped at the ${s.clip.frameStamp ?? 'middle'} · mark times moved ${formatNumber((s.fitInput.exposureShiftS ?? 0) * 1000, { decimals: 3 })} ms to mid-exposure` }]
            : []),
          ...(s.shot.wind
            ? [{ label: 'Wind', value: `${formatNumber(s.shot.wind.speedMps, { decimals: 1 })} m/s from ${formatNumber(s.shot.wind.fromDeg, { decimals: 0 })}° (0° headwind) · ${formatNumber(s.fitInput.windXMps ?? 0, { decimals: 2 })} m/s along the line of fire in the fit` }]
            : []),
          ...(s.shot.launchHeightM != null ? [{ label: 'Launch height', value: `${formatNumber(s.shot.launchHeightM, { decimals: 2 })} m`, numeric: true }] : []),
        ]}
      />
    </Card>
  );
}
