import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatNumber } from '@/lib/format';
import { useKeepOut } from '@/api/presets/keep-out';
import { KeepOutSafety } from './keep-out-safety';
import { cdText, kPa, metres, pctText } from './preset-format';

/** The keep-out distance, the vacuum ceiling under it as a secondary cross-check, and the cautions above both. */
export function KeepOutPanel({ teamId, presetId, version }: { teamId: string; presetId: string; version?: number }) {
  const keepOut = useKeepOut(teamId, presetId, version);
  return (
    <Card title="Keep-out distance" subtitle="Worst case at the launcher’s maximum working pressure, times the team’s safety factor">
      <div className="flex flex-col gap-3">
        <KeepOutSafety />
        <FormError error={keepOut.error} />
        {keepOut.isLoading && <LoadingBlock />}
        {keepOut.data && (
          <>
            <div>
              <p className="text-micro uppercase tracking-wide text-ink-faint">Keep-out distance</p>
              <p className="text-display font-semibold tabular-nums text-alert" data-testid="keep-out-distance">{metres(keepOut.data.keepOutM, 0)}</p>
              {/* The ceiling is a cross-check, not a second distance to keep: it stays in body type under the one number that matters. */}
              <p className="mt-1 text-body text-ink-soft" data-testid="vacuum-ceiling-line">
                Vacuum ceiling v²/g: <span className="tabular-nums text-vacuum" data-testid="vacuum-ceiling">{metres(keepOut.data.vacuumCeilingM, 0)}</span>{' '}
                <span className="text-micro text-ink-faint">— the farthest the upper-bound speed could carry with no air at all; a check on the figure above, not a distance to use.</span>
              </p>
            </div>
            <KeyValueList
              items={[
                { label: 'Version', value: `v${keepOut.data.version}` },
                { label: 'Maximum working pressure', value: kPa(keepOut.data.maxWorkingPressurePa), numeric: true },
                { label: 'Upper-bound efficiency (η + 2σ, at most 1)', value: pctText(keepOut.data.efficiencyUpper), numeric: true },
                { label: 'Upper-bound muzzle speed', value: `${formatNumber(keepOut.data.speedUpperMps, { decimals: 1 })} m/s`, numeric: true },
                { label: 'Lower-bound Cd (Cd − 2σ, above 0)', value: cdText(keepOut.data.dragCoefficientLower), numeric: true },
                { label: 'Elevation that carries furthest', value: `${formatNumber(keepOut.data.bestElevationDeg, { decimals: 1 })}°`, numeric: true },
                { label: 'Worst-case range with drag', value: metres(keepOut.data.maxRangeM), numeric: true },
                { label: 'Safety factor', value: `× ${formatNumber(keepOut.data.safetyFactor, { decimals: 2 })}`, numeric: true },
                { label: 'Vacuum range at the upper-bound speed', value: metres(keepOut.data.vacuumAtUpperSpeedM), numeric: true },
              ]}
            />
            <p className="text-micro text-ink-faint">{keepOut.data.method}</p>
          </>
        )}
      </div>
    </Card>
  );
}
