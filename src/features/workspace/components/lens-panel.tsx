import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { KeyValueList } from '@/components/ui/key-value-list';
import { SelectField } from '@/components/ui/select-field';
import { useLensProfiles } from '@/api/lens-profiles/list-lens-profiles';
import { ApiError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import type { Calibration } from '@shared/schemas/marking';
import { lensInputOf } from '../editor/calibration-geometry';
import { lensOfProfile, profileFitsFrame } from '../editor/lens-profile-choice';
import type { Editor } from '../editor/editor-store';
import type { LensDraft, Point } from '../editor/types';
import { useEditor } from '../hooks/use-editor';
import { LensCoefficientsDialog } from './lens-coefficients-dialog';

interface LensPanelProps {
  editor: Editor;
  teamId: string;
  frameSize: { width: number; height: number };
  saved: Calibration | null;
  /** The last failed save, to show the server's word on the lens beside it. */
  saveError: unknown;
}

/** "−0.1200 ± 0.0012": a coefficient with its standard uncertainty. */
function withSigma(value: number, sigma: number): string {
  return sigma > 0 ? `${formatNumber(value, { digits: 4 })} ± ${formatNumber(sigma, { digits: 2 })}` : formatNumber(value, { digits: 4 });
}

const sameEdges = (a: readonly Point[][] | null | undefined, b: readonly Point[][]) => JSON.stringify(a ?? []) === JSON.stringify(b);

function sourceText(lens: LensDraft): string {
  if (lens.source === 'straight-lines') return `fitted to ${lens.straightLines?.length ?? 0} straight edges`;
  if (lens.source === 'profile') return `team lens profile “${lens.profile?.name ?? 'unnamed'}”`;
  return 'stated coefficients';
}

/**
 * The lens part of the calibration: fit the clicked straight edges, or state
 * known coefficients; show the model, the coefficients with their standard
 * uncertainties, the straightness residual and the fit's remarks; switch the
 * corrected grid on the frame.
 */
export function LensPanel({ editor, teamId, frameSize, saved, saveError }: LensPanelProps) {
  const profiles = useLensProfiles(teamId);
  const draft = useEditor(editor, (s) => s.calibrationDraft);
  const canCalibrate = useEditor(editor, (s) => s.permissions.canCalibrate);
  const gridOn = useEditor(editor, (s) => s.lensGridOn);
  const [fitting, setFitting] = useState(false);
  const [fitError, setFitError] = useState<string | null>(null);
  const [entering, setEntering] = useState(false);
  const { lens, straightLines } = draft;
  const pointCount = straightLines.reduce((n, l) => n + l.length, 0);
  const asSaved = !!(lens && saved?.lens && JSON.stringify(lensInputOf(lens)) === JSON.stringify(lensInputOf(saved.lens)));
  const edgesChanged = lens?.source === 'straight-lines' && !sameEdges(lens.straightLines, straightLines);
  const serverWord = saveError instanceof ApiError && saveError.fields.some((f) => f.path.startsWith('body.lens')) ? saveError.detail : null;

  const fit = async () => {
    setFitting(true);
    setFitError(null);
    try {
      // The fit (and its least-squares solver) loads only when someone fits.
      const { fitLensToEdges } = await import('../editor/lens-edge-fit');
      const r = fitLensToEdges(straightLines, { widthPx: frameSize.width, heightPx: frameSize.height });
      if (r.ok) editor.setCalibration({ lens: r.lens });
      else setFitError(r.message);
    } finally {
      setFitting(false);
    }
  };

  return (
    <section aria-label="Lens correction" className="mt-3 border-t border-line pt-3">
      <h3 className="mb-1 text-micro font-medium uppercase tracking-wide text-ink-soft">Lens correction</h3>
      {lens ? (
        <>
          <KeyValueList
            items={[
              { label: 'Model', value: `Brown–Conrady radial (${lens.terms === 1 ? 'k1 only' : 'k1, k2'}), about the frame centre` },
              { label: 'Source', value: sourceText(lens) },
              { label: 'k1 (± 1σ)', value: withSigma(lens.k1, lens.k1StdUnc), numeric: true },
              { label: 'k2 (± 1σ)', value: lens.terms === 1 ? 'not fitted (0)' : withSigma(lens.k2, lens.k2StdUnc), numeric: true },
              ...(lens.residualRmsPx !== null
                ? [{ label: 'Straightness residual', value: `${formatNumber(lens.residualRmsPx, { digits: 3 })} px RMS`, numeric: true }]
                : []),
            ]}
          />
          {lens.notes.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-micro text-ink-soft">
              {lens.notes.map((n) => <li key={n}>{n}</li>)}
            </ul>
          )}
          <p className="mt-1 text-micro text-ink-faint">
            {asSaved
              ? `As saved in version ${saved?.version}.`
              : lens.source === 'straight-lines'
                ? 'Fitted here with the same code the server runs; saving sends the edges and the server fits them again.'
                : lens.source === 'profile'
                  ? 'Not saved yet: saving copies the profile’s coefficients into the next version.'
                  : 'Not saved yet: saving stores these coefficients with the next version.'}
          </p>
        </>
      ) : (
        <p className="text-body text-ink-soft">None — an ideal lens is assumed.</p>
      )}
      <p className="mt-2 text-micro text-ink-soft" data-testid="straight-edge-count">
        {straightLines.length === 0
          ? 'No straight edges clicked. Use the Straight edge tool (E) on rails, posts or building edges near the frame sides.'
          : `${straightLines.length} straight edge${straightLines.length === 1 ? '' : 's'} clicked (${pointCount} points)${edgesChanged ? ' — changed since the fit' : ''}.`}
      </p>
      {canCalibrate && (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button size="sm" variant="primary" disabled={straightLines.length === 0} busy={fitting} onClick={fit}>
            Fit lens to {straightLines.length === 1 ? 'the edge' : `${straightLines.length} edges`}
          </Button>
          <Button size="sm" onClick={() => setEntering(true)}>Enter coefficients…</Button>
          {lens && <Button size="sm" variant="ghost" onClick={() => editor.setCalibration({ lens: null })}>No lens correction</Button>}
          {straightLines.length > 0 && <Button size="sm" variant="ghost" onClick={() => editor.setCalibration({ straightLines: [] })}>Clear edges</Button>}
        </div>
      )}
      {canCalibrate && profiles.data && profiles.data.length > 0 && (
        <SelectField
          fieldClassName="mt-2"
          label="Team lens profile"
          placeholder="Choose a profile…"
          value={lens?.source === 'profile' ? (lens.profile?.id ?? '') : ''}
          options={profiles.data.map((p) => ({
            value: p.id,
            label: profileFitsFrame(p, frameSize) ? `${p.name} (${p.frameWidthPx}×${p.frameHeightPx})` : `${p.name} — measured on ${p.frameWidthPx}×${p.frameHeightPx}, another frame shape`,
            disabled: !profileFitsFrame(p, frameSize),
          }))}
          onChange={(e) => {
            const p = profiles.data.find((x) => x.id === e.target.value);
            if (p) editor.setCalibration({ lens: lensOfProfile(p, frameSize) });
          }}
        />
      )}
      <CheckboxField
        fieldClassName="mt-2"
        label="Show the corrected grid on the frame"
        hint={lens ? 'Straight world lines as this lens shows them; they should bow with the rails.' : 'Needs a lens correction.'}
        checked={gridOn && !!lens}
        disabled={!lens}
        onChange={(e) => editor.setLensGrid(e.target.checked)}
      />
      {fitError && <p role="alert" className="mt-2 text-micro text-alert">Not fitted: {fitError}</p>}
      {serverWord && <p role="alert" className="mt-2 text-micro text-alert">The server refused the lens: {serverWord}</p>}
      {entering && <LensCoefficientsDialog editor={editor} frameSize={frameSize} current={lens} onClose={() => setEntering(false)} />}
    </section>
  );
}
