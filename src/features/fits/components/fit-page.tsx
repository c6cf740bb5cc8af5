import { Link, useParams } from 'react-router';
import { CAN } from '@shared/roles';
import { Card } from '@/components/ui/card';
import { errorMessage } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { SafetyNote } from '@/components/ui/safety-note';
import { LoadingBlock } from '@/components/ui/spinner';
import { formatDateTime } from '@/lib/format';
import { useCurrentTeam } from '@/lib/use-current-team';
import { fitExportUrl } from '@/api/fits/fit-exports';
import { useFit } from '@/api/fits/get-fit';
import { useFitPlots } from '../hooks/use-fit-plots';
import { AuditTrail } from './audit-trail';
import { EstimatesCard } from './estimates-card';
import { FitStateBadge } from './fit-state-badge';
import { FlowCard } from './flow-card';
import { FrameOverlay } from './frame-overlay';
import { InputsCard } from './inputs-card';
import { LauncherCard } from './launcher-card';
import { PresetForecastCard } from './preset-forecast-card';
import { ReproduceButton } from './reproduce-button';
import { ResidualChart } from './residual-chart';
import { ReviewPanel } from './review-panel';
import { SpeedChart } from './speed-chart';
import { TrajectoryChart } from './trajectory-chart';
import { UncertaintyCard } from './uncertainty-card';

/** The engineer's page for one fit: numbers with intervals and their sources, plots, checks, sign-off. */
export function FitPage() {
  const { fitId = '' } = useParams();
  const { teamId, can } = useCurrentTeam();
  const { data: fit, error, isPending } = useFit(teamId, fitId);
  const plots = useFitPlots(fit);

  if (isPending) return <LoadingBlock />;
  if (error || !fit || !plots) {
    return (
      <div role="alert" className="rounded-card border border-alert/40 bg-alert-light/50 p-4 text-body text-alert">
        {errorMessage(error)}
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <PageHeader
        eyebrow={<Link to={`/t/${teamId}/shots/${fit.shotId}/fits`}>{fit.shot.seriesName ?? 'Shot'} · fits of {fit.shot.label}</Link>}
        title={`Fit of ${fit.shot.label}`}
        subtitle={`Run ${formatDateTime(fit.createdAt)} by ${fit.createdBy?.displayName ?? 'unknown'} · launcher ${fit.shot.launcherName ?? '—'} · projectile ${fit.shot.projectileName ?? '—'}`}
        actions={<FitStateBadge state={fit.state} inputsChanged={fit.staleness.inputsChanged} />}
      />
      {fit.staleness.message && (
        <p role="status" className="rounded-md border border-line bg-paper-sunk px-3 py-2 text-body text-ink">
          {fit.staleness.message}
        </p>
      )}
      {fit.sameInputsAs && (
        <p role="note" className="rounded-md border border-signal/50 bg-signal-light/30 px-3 py-2 text-body text-ink" data-testid="same-inputs">
          This fit ran on inputs identical to{' '}
          <Link className="font-medium text-signal-dark underline" to={`/t/${teamId}/fits/${fit.sameInputsAs.id}`}>
            fit {fit.sameInputsAs.number}
          </Link>{' '}
          of this shot (run {formatDateTime(fit.sameInputsAs.createdAt)}): the same marks, calibration, projectile and air, so its numbers are the same. Review that fit
          rather than this one, or change an input before running again.
        </p>
      )}
      <SafetyNote>
        <p>Launchers and pressure vessels can injure. Follow local codes, range-safety rules and licensed practice.</p>
        <p className="text-micro text-ink-soft">A measured speed and drag describe this shot only; keep downrange areas clear with the margins your range rules require.</p>
      </SafetyNote>
      <div className="grid gap-4 xl:grid-cols-[3fr_2fr]">
        <EstimatesCard result={fit.result} snapshot={fit.snapshot} />
        <ReviewPanel teamId={teamId} fit={fit} canReview={can(CAN.review)} />
      </div>
      <div className="grid gap-4 xl:grid-cols-2">
        <Card title="Trajectory" subtitle="World units: marks, drag fit and drag-free fit">
          <TrajectoryChart plots={plots} />
        </Card>
        <Card title="Speed against time" subtitle="Fitted curves and finite differences of the marks">
          <SpeedChart plots={plots} />
        </Card>
        <Card title="Residuals against time" subtitle="Mark minus fitted position, headline model">
          <ResidualChart plots={plots} />
        </Card>
        <Card title="Fit on the frame">
          <FrameOverlay teamId={teamId} fit={fit} plots={plots} />
        </Card>
      </div>
      <div className="grid gap-4 xl:grid-cols-2">
        <UncertaintyCard result={fit.result} snapshot={fit.snapshot} />
        <FlowCard result={fit.result} />
        <LauncherCard result={fit.result} snapshot={fit.snapshot} />
        <InputsCard fit={fit} />
        <PresetForecastCard teamId={teamId} fit={fit} />
      </div>
      <Card title="Exports and checks">
        <div className="flex flex-wrap items-center gap-3 text-body">
          <a className="font-medium text-signal-dark underline" href={fitExportUrl(teamId, fit.id, 'export.csv')} download>
            Marks and residuals (CSV)
          </a>
          <a className="font-medium text-signal-dark underline" href={fitExportUrl(teamId, fit.id, 'export.json')} download>
            Whole fit (JSON)
          </a>
          <a className="font-medium text-signal-dark underline" href={fitExportUrl(teamId, fit.id, 'report.pdf')} download>
            Report (PDF)
          </a>
          <ReproduceButton teamId={teamId} fitId={fit.id} />
        </div>
      </Card>
      <AuditTrail entries={fit.audit} />
    </div>
  );
}

