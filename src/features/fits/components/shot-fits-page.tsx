import { Link, useNavigate, useParams } from 'react-router';
import { CAN } from '@shared/roles';
import type { FitSummary } from '@shared/schemas/fits';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { FormError, errorMessage } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useShotFits } from '@/api/fits/get-shot-fits';
import { useRunFit } from '@/api/fits/run-fit';
import { FitStateBadge } from './fit-state-badge';
import { formatDateTime, formatNumber } from '@/lib/format';

/** A shot's fits, newest first, and the place to run a new one from a marked track. */
export function ShotFitsPage() {
  const { shotId = '' } = useParams();
  const { teamId, can } = useCurrentTeam();
  const navigate = useNavigate();
  const { data, error, isPending } = useShotFits(teamId, shotId);
  const run = useRunFit(teamId);

  if (isPending) return <LoadingBlock />;
  if (error || !data) return <p role="alert" className="text-body text-alert">{errorMessage(error)}</p>;
  const projectileTracks = data.tracks.filter((t) => t.kind === 'projectile');
  return (
    <div className="space-y-4">
      <PageHeader eyebrow={data.shot.seriesName ?? 'Shot'} title={`Fits of ${data.shot.label}`} subtitle="Each fit runs the drag and drag-free models on the server and keeps a copy of every input it used." />
      <Card title="Run a fit" subtitle="Uses the track's marks, the clip's current calibration and the shot's projectile and conditions">
        {projectileTracks.length === 0 ? (
          <p className="text-body text-ink-soft">No projectile track yet: mark the projectile on the shot's clip first.</p>
        ) : (
          <ul className="space-y-2">
            {projectileTracks.map((t) => (
              <li key={t.id} className="flex items-center justify-between gap-3">
                <span className="text-body">
                  <span className="font-medium">{t.name}</span> · {t.markCount} marks ·{' '}
                  <Link className="text-signal-dark underline" to={`/t/${teamId}/clips/${t.clipId}/workspace`}>
                    open in the workspace
                  </Link>
                </span>
                {can(CAN.runFits) && (
                  <Button
                    variant="primary"
                    size="sm"
                    busy={run.isPending && run.variables === t.id}
                    disabled={run.isPending || t.markCount < 5}
                    // One button per track: the name says which track, so a screen reader's button list tells them apart.
                    aria-label={`Run fit on ${t.name}`}
                    title={t.markCount < 5 ? 'A fit needs at least 5 marks' : undefined}
                    onClick={() => run.mutate(t.id, { onSuccess: (fit) => navigate(`/t/${teamId}/fits/${fit.id}`) })}
                  >
                    Run fit
                  </Button>
                )}
              </li>
            ))}
          </ul>
        )}
        {run.isPending && <p role="status" className="mt-2 text-micro text-ink-faint">Fitting on the server…</p>}
        <FormError error={run.error} className="mt-2" />
      </Card>
      <Card title="Fits" flush>
        {data.fits.length === 0 ? (
          <div className="p-4">
            <EmptyState title="No fits yet." />
          </div>
        ) : (
          <table className="w-full text-body" aria-label="Fits of this shot">
            <thead className="bg-paper-sunk/70 text-left text-micro uppercase tracking-wide text-ink-soft">
              <tr>
                <th className="px-3 py-2">Run</th>
                <th className="px-3 py-2">State</th>
                <th className="px-3 py-2 text-right">Speed</th>
                <th className="px-3 py-2 text-right">Cd</th>
                <th className="px-3 py-2 text-right">RMS</th>
              </tr>
            </thead>
            <tbody>
              {data.fits.map((f) => (
                <FitRow key={f.id} teamId={teamId} fit={f} />
              ))}
            </tbody>
          </table>
        )}
      </Card>
    </div>
  );
}

function FitRow({ teamId, fit }: { teamId: string; fit: FitSummary }) {
  return (
    <tr className="border-t border-line/70">
      <td className="px-3 py-2">
        <Link className="font-medium text-signal-dark underline" to={`/t/${teamId}/fits/${fit.id}`}>
          {formatDateTime(fit.createdAt)}
        </Link>
        <span className="ml-2 text-micro text-ink-faint">{fit.createdBy?.displayName}</span>
      </td>
      <td className="px-3 py-2">
        <FitStateBadge state={fit.state} inputsChanged={fit.inputsChanged} />
      </td>
      <td className="px-3 py-2 text-right tabular-nums">{formatNumber(fit.launchSpeedMps, { decimals: 2 })} m/s</td>
      <td className="px-3 py-2 text-right tabular-nums">{fit.dragCoefficient === null ? '—' : formatNumber(fit.dragCoefficient, { decimals: 3 })}</td>
      <td className="px-3 py-2 text-right tabular-nums">{formatNumber(fit.rmsResidualM * 1000, { decimals: 2 })} mm</td>
    </tr>
  );
}
