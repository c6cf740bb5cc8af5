import { useParams } from 'react-router';
import { CAN } from '@shared/roles';
import { ButtonLink } from '@/components/ui/button-link';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatNumber } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useCandidates } from '@/api/presets/get-candidates';
import { usePreset } from '@/api/presets/get-preset';
import { KeepOutPanel } from './keep-out-panel';
import { MeasuredVsForecastChart } from './measured-vs-forecast-chart';
import { kPa } from './preset-format';
import { PublishVersionPanel } from './publish-version-panel';
import { VersionHistory } from './version-history';

const mm = (m: number | null) => (m === null ? '—' : `${formatNumber(m * 1000, { decimals: 1 })}\u00a0mm`);

export function PresetPage() {
  const { presetId = '' } = useParams();
  const { teamId, can } = useCurrentTeam();
  const preset = usePreset(teamId, presetId);
  const candidates = useCandidates(teamId, presetId);
  if (preset.isLoading) return <LoadingBlock />;
  if (!preset.data) return <FormError error={preset.error} />;
  const p = preset.data;
  const labels = new Map((candidates.data ?? []).map((c) => [c.fitId, c.shotLabel]));
  const fitLabel = (id: string) => labels.get(id) ?? `fit ${id.slice(0, 8)}`;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow="Design preset"
        title={p.name}
        subtitle={`${p.launcher.name} with ${p.projectile.name}, ${kPa(p.pressureMinPa)} to ${kPa(p.pressureMaxPa)}`}
        actions={<ButtonLink to={`/t/${teamId}/forecast?preset=${p.id}`} variant="primary">Forecast with this preset</ButtonLink>}
      />
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Launcher">
          <KeyValueList
            items={[
              { label: 'Name', value: p.launcher.name },
              { label: 'Bore', value: mm(p.launcherRecord.boreM), numeric: true },
              { label: 'Barrel length', value: p.launcherRecord.barrelLengthM === null ? '—' : `${formatNumber(p.launcherRecord.barrelLengthM, { decimals: 2 })} m`, numeric: true },
              { label: 'Chamber volume', value: p.launcherRecord.chamberVolumeM3 === null ? '—' : `${formatNumber(p.launcherRecord.chamberVolumeM3 * 1000, { decimals: 2 })} L`, numeric: true },
              { label: 'Maximum working pressure', value: kPa(p.launcherRecord.maxWorkingPressurePa), numeric: true },
              { label: 'Valve', value: p.launcherRecord.valveType ?? '—' },
            ]}
          />
        </Card>
        <Card title="Projectile">
          <KeyValueList
            items={[
              { label: 'Name', value: p.projectile.name },
              { label: 'Mass', value: `${formatNumber(p.projectileRecord.massKg * 1000, { decimals: 1 })} g`, numeric: true },
              { label: 'Diameter', value: mm(p.projectileRecord.diameterM), numeric: true },
              { label: 'Shape', value: p.projectileRecord.shape ?? '—' },
              { label: 'Reference area', value: p.projectileRecord.referenceAreaM2 === null ? 'π d²/4' : `${formatNumber(p.projectileRecord.referenceAreaM2 * 1e4, { decimals: 2 })} cm²`, numeric: true },
            ]}
          />
        </Card>
      </div>
      <KeepOutPanel teamId={teamId} presetId={p.id} />
      {can(CAN.editPresets) && candidates.data && <PublishVersionPanel teamId={teamId} presetId={p.id} candidates={candidates.data} />}
      <VersionHistory versions={p.versions} fitLabel={fitLabel} />
      <MeasuredVsForecastChart teamId={teamId} presetId={p.id} />
    </div>
  );
}
