import { useState, type ReactNode } from 'react';
import { useNavigate, useParams } from 'react-router';
import { CAN } from '@shared/roles';
import { Button } from '@/components/ui/button';
import { ButtonLink } from '@/components/ui/button-link';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatDateTime, formatPressure, formatQuantity } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useDeleteShot } from '@/api/shots/delete-shot';
import { useShot } from '@/api/shots/get-shot';

export interface ShotDetailPageProps {
  /**
   * The clip panel, supplied by the router from the clips feature (features do
   * not import each other, so the page leaves a slot for it).
   */
  clipPanel: (shot: { teamId: string; shotId: string; canEdit: boolean }) => ReactNode;
}

export function ShotDetailPage({ clipPanel }: ShotDetailPageProps) {
  const { teamId, can } = useCurrentTeam();
  const { shotId = '' } = useParams();
  const navigate = useNavigate();
  const shot = useShot(teamId, shotId);
  const remove = useDeleteShot(teamId);
  const [confirming, setConfirming] = useState(false);
  const canEdit = can(CAN.editShots);

  if (shot.isLoading) return <LoadingBlock label="Loading the shot…" />;
  if (!shot.data) return <FormError error={shot.error} />;
  const s = shot.data;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={s.seriesName}
        title={`Shot ${s.label}`}
        subtitle={`Entered ${formatDateTime(s.createdAt)}`}
        actions={
          <>
            <ButtonLink to={`/t/${teamId}/shots/${shotId}/fits`}>Fits</ButtonLink>
            {canEdit && (
              <>
                <ButtonLink to={`/t/${teamId}/shots/${shotId}/edit`}>Edit shot</ButtonLink>
                <Button variant="ghost" onClick={() => setConfirming(true)}>
                  Delete
                </Button>
              </>
            )}
          </>
        }
      />
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
        <Card title="Conditions" subtitle="As recorded at the launcher">
          <KeyValueList
            items={[
              { label: 'Launcher', value: s.launcherName ?? '—' },
              { label: 'Projectile', value: s.projectileName ?? '—' },
              { label: 'Chamber pressure', value: formatPressure(s.chamberPressurePa), numeric: true },
              { label: 'Elevation setting', value: formatQuantity(s.elevationDeg, '°', { decimals: 1 }), numeric: true },
              { label: 'Air temperature', value: formatQuantity(s.airTempC, '°C', { decimals: 1 }), numeric: true },
              { label: 'Station pressure', value: formatPressure(s.stationPressurePa), numeric: true },
              { label: 'Relative humidity', value: formatQuantity(s.relativeHumidityPct, '%', { decimals: 0 }), numeric: true },
              { label: 'Tape-measured range', value: formatQuantity(s.tapeRangeM, 'm', { decimals: 2 }), numeric: true },
              { label: 'Launch height', value: formatQuantity(s.launchHeightM, 'm', { decimals: 2 }), numeric: true },
              { label: 'Air density (stated)', value: s.airDensity ? `${formatQuantity(s.airDensity.densityKgM3, 'kg/m³', { decimals: 3 })}${s.airDensity.tolKgM3 !== null ? ` ± ${formatQuantity(s.airDensity.tolKgM3, 'kg/m³', { decimals: 3 })}` : ''}` : '—', numeric: true },
              { label: 'Wind', value: s.wind ? `${formatQuantity(s.wind.speedMps, 'm/s', { decimals: 1 })} from ${formatQuantity(s.wind.fromDeg, '°', { decimals: 0 })} (0° headwind)` : '—' },
            ]}
          />
          {s.notes && <p className="mt-3 text-body whitespace-pre-line text-ink-soft">{s.notes}</p>}
        </Card>
        <div className="min-w-0">{clipPanel({ teamId, shotId, canEdit })}</div>
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Delete shot ${s.label}?`}
        description="The shot record goes. A shot that still has clips cannot be deleted; delete its clips first."
        confirmLabel="Delete shot"
        busy={remove.isPending}
        onClose={() => {
          setConfirming(false);
          remove.reset();
        }}
        onConfirm={() => remove.mutate(shotId, { onSuccess: () => navigate(`/t/${teamId}/shots`) })}
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </div>
  );
}
