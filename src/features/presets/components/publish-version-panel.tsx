import { useState } from 'react';
import type { FitCandidate, PoolPreview } from '@shared/schemas/presets';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { InlineStatus } from '@/components/ui/inline-status';
import { TextField } from '@/components/ui/text-field';
import { formatNumber } from '@/lib/format';
import { usePoolPreview } from '@/api/presets/pool-preview';
import { usePublishVersion } from '@/api/presets/publish-version';
import { disagreements } from './pool-disagreement';
import { cdText, kPa, pctText } from './preset-format';

function PooledLine({ label, p, format }: { label: string; p: PoolPreview['dragCoefficient'] | null; format: (v: number, s: number) => string }) {
  if (!p) return <p className="text-ink-soft">{label}: no fit gives a value; the previous version’s value is carried.</p>;
  return (
    <div>
      <p className="tabular-nums">
        <span className="font-medium">{label}:</span> {format(p.value, p.stdErr)} <span className="text-ink-faint">from {p.count} fit{p.count === 1 ? '' : 's'}</span>
      </p>
      <p className={p.disagree ? 'font-medium text-alert' : 'text-ink-soft'}>{p.verdict}</p>
    </div>
  );
}

/** Choose approved fits, see what pooling them gives (and whether they agree), then publish. */
export function PublishVersionPanel({ teamId, presetId, candidates }: { teamId: string; presetId: string; candidates: FitCandidate[] }) {
  const usable = candidates.filter((c) => c.usable);
  const [chosen, setChosen] = useState<Set<string>>(() => new Set());
  const [note, setNote] = useState('');
  // The fits the engineer asked to pool; null until they ask, and again after any change of choice.
  const [requested, setRequested] = useState<string[] | null>(null);
  const preview = usePoolPreview(teamId, presetId, requested);
  const publish = usePublishVersion(teamId, presetId);
  const [published, setPublished] = useState<number | null>(null);
  // Fits that disagree (high I²) are published only after the engineer has read that they do.
  const [confirming, setConfirming] = useState(false);
  const disagreeing = preview.data ? disagreements(preview.data) : [];

  const toggle = (id: string) => {
    setChosen((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
    setRequested(null);
    setPublished(null);
  };
  const fitIds = [...chosen];
  const doPublish = () =>
    publish.mutate(
      { fitIds, note },
      {
        onSuccess: (v) => {
          setPublished(v.version);
          setChosen(new Set());
          setNote('');
          setRequested(null);
        },
        onSettled: () => setConfirming(false),
      },
    );

  return (
    <Card title="Publish a new version" subtitle="Pool approved fits of this launcher and projectile by inverse-variance weighting">
      {usable.length === 0 ? (
        <p className="text-body text-ink-soft">No approved fit of this launcher and projectile resolves drag yet. Approve fits on the shot results page first.</p>
      ) : (
        <div className="flex flex-col gap-3">
          <fieldset>
            <legend className="mb-1 text-micro uppercase tracking-wide text-ink-faint">Approved fits</legend>
            <ul className="flex flex-col gap-1">
              {candidates.map((c) => (
                <li key={c.fitId}>
                  <label className="flex items-baseline gap-2 text-body">
                    <input type="checkbox" disabled={!c.usable} checked={chosen.has(c.fitId)} onChange={() => toggle(c.fitId)} aria-label={`Pool ${c.shotLabel}`} />
                    <span className="font-medium">{c.shotLabel}</span>
                    <span className="tabular-nums text-ink-soft">
                      Cd {c.dragCoefficient ? cdText(c.dragCoefficient.value, c.dragCoefficient.stdErr) : '—'} · η {c.efficiency ? pctText(c.efficiency.value, c.efficiency.stdErr) : '—'} · {kPa(c.chamberPressurePa)}
                    </span>
                    {c.notes.length > 0 && <span className="text-micro text-ink-faint">({c.notes.join('; ')})</span>}
                  </label>
                </li>
              ))}
            </ul>
          </fieldset>
          <TextField label="Note" value={note} onChange={(e) => setNote(e.target.value)} placeholder="Why this version" maxLength={2000} />
          <div className="flex flex-wrap gap-2">
            <Button disabled={fitIds.length === 0} busy={preview.isFetching} onClick={() => setRequested(fitIds)}>
              Pool {fitIds.length || ''} fit{fitIds.length === 1 ? '' : 's'}
            </Button>
            <Button variant="primary" disabled={!preview.data} busy={publish.isPending && !confirming} onClick={() => (disagreeing.length > 0 ? setConfirming(true) : doPublish())}>
              Publish version
            </Button>
          </div>
          <FormError error={preview.error ?? publish.error} />
          {preview.data && (
            <div className="rounded-card border border-line bg-paper p-3 text-body" data-testid="pool-preview">
              <PooledLine label="Drag coefficient" p={preview.data.dragCoefficient} format={cdText} />
              <PooledLine label="Launcher efficiency" p={preview.data.efficiency} format={pctText} />
              {preview.data.notes.length > 0 && <p className="mt-1 text-micro text-ink-faint">{preview.data.notes.join(' · ')}</p>}
              <p className="mt-1 text-micro text-ink-faint">
                Heterogeneity: Cochran’s Q with a χ² p-value and I²; above I² 50 % or below p 0.05 the uncertainty is widened by √(Q/(k−1)) (common practice). Cd χ² p ={' '}
                {preview.data.dragCoefficient.pValue === null ? '—' : formatNumber(preview.data.dragCoefficient.pValue, { digits: 2 })}.
              </p>
            </div>
          )}
          {published !== null && <InlineStatus tone="ok">Version {published} published.</InlineStatus>}
          <ConfirmDialog
            open={confirming}
            title="Publish although the fits disagree?"
            description="The chosen fits disagree more than their intervals allow, so the pooled uncertainty has been widened. Check for a changed launcher, projectile or marking before publishing."
            confirmLabel="Publish anyway"
            tone="primary"
            busy={publish.isPending}
            onConfirm={doPublish}
            onClose={() => setConfirming(false)}
          >
            <ul className="list-disc pl-5 text-body tabular-nums" data-testid="publish-heterogeneity">
              {disagreeing.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </ConfirmDialog>
        </div>
      )}
    </Card>
  );
}
