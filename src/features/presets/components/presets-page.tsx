import { useState } from 'react';
import { Link } from 'react-router';
import { CAN } from '@shared/roles';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatDateTime } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { usePresets } from '@/api/presets/list-presets';
import { CreatePresetDialog } from './create-preset-dialog';
import { cdText, kPa, pctText } from './preset-format';

/** The team's presets with their current values; each links to its history. */
export function PresetsPage() {
  const { teamId, can } = useCurrentTeam();
  const presets = usePresets(teamId);
  const [creating, setCreating] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Design presets"
        subtitle="A launcher and projectile over a pressure range, with the drag coefficient and launcher efficiency the team’s approved shots support."
        actions={can(CAN.editPresets) && <Button variant="primary" onClick={() => setCreating(true)}>New preset</Button>}
      />
      <FormError error={presets.error} />
      {presets.isLoading && <LoadingBlock />}
      {presets.data && presets.data.length === 0 && <EmptyState title="No presets yet">An engineer starts one from a handbook drag value and folds in approved fits.</EmptyState>}
      <ul className="grid gap-4 md:grid-cols-2" aria-label="Presets">
        {presets.data?.map((p) => (
          <li key={p.id}>
            <Card title={<Link className="underline decoration-line-strong underline-offset-4 hover:text-fit-dark" to={`/t/${teamId}/presets/${p.id}`}>{p.name}</Link>} subtitle={`${p.launcher.name} · ${p.projectile.name}`}>
              {p.latest ? (
                <dl className="grid grid-cols-2 gap-2 text-body">
                  <div>
                    <dt className="text-micro text-ink-faint">Drag coefficient</dt>
                    <dd className="tabular-nums">{cdText(p.latest.dragCoefficient, p.latest.dragCoefficientStd)}</dd>
                  </div>
                  <div>
                    <dt className="text-micro text-ink-faint">Launcher efficiency</dt>
                    <dd className="tabular-nums">{pctText(p.latest.efficiency, p.latest.efficiencyStd)}</dd>
                  </div>
                  <div>
                    <dt className="text-micro text-ink-faint">Pressure range</dt>
                    <dd className="tabular-nums">
                      {kPa(p.pressureMinPa)} – {kPa(p.pressureMaxPa)}
                    </dd>
                  </div>
                  <div>
                    <dt className="text-micro text-ink-faint">Version</dt>
                    <dd>
                      v{p.latest.version} of {p.versionCount} · {formatDateTime(p.latest.publishedAt)}
                    </dd>
                  </div>
                  <p className="col-span-2 text-micro text-ink-soft">{p.latest.dragSource}</p>
                </dl>
              ) : (
                <p className="text-ink-soft">No version yet.</p>
              )}
            </Card>
          </li>
        ))}
      </ul>
      {creating && <CreatePresetDialog teamId={teamId} onClose={() => setCreating(false)} />}
    </div>
  );
}
