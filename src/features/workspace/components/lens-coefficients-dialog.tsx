import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/text-field';
import { coefficientProblem } from '@shared/geometry/lens-distortion';
import { LensCoefficients } from '@shared/schemas/camera';
import type { Editor } from '../editor/editor-store';
import { parseTyped as parse } from '../editor/typed-number';
import type { LensDraft } from '../editor/types';

interface LensCoefficientsDialogProps {
  editor: Editor;
  frameSize: { width: number; height: number };
  current: LensDraft | null;
  onClose: () => void;
}

const shown = (v: number | undefined) => (v === undefined ? '' : String(v));

/** Known radial coefficients (a lens the team measured once), each with its standard uncertainty. */
export function LensCoefficientsDialog({ editor, frameSize, current, onClose }: LensCoefficientsDialogProps) {
  const start = current?.source === 'coefficients' ? current : undefined;
  const [k1, setK1] = useState(shown(start?.k1));
  const [k1Unc, setK1Unc] = useState(shown(start?.k1StdUnc ?? 0));
  const [k2, setK2] = useState(shown(start?.k2 ?? 0));
  const [k2Unc, setK2Unc] = useState(shown(start?.k2StdUnc ?? 0));
  const [correlation, setCorrelation] = useState(shown(start?.k1k2Correlation ?? 0));
  const [error, setError] = useState<string | null>(null);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = LensCoefficients.safeParse({ k1: parse(k1), k2: parse(k2), k1StdUnc: parse(k1Unc), k2StdUnc: parse(k2Unc), k1k2Correlation: parse(correlation) });
    if (!parsed.success) return setError(`${parsed.error.issues[0].message}.`);
    // The same check the server makes: coefficients must not fold the picture before its corners.
    const problem = coefficientProblem(parsed.data);
    if (problem) return setError(problem);
    editor.setCalibration({
      lens: {
        model: 'brown-conrady-radial',
        source: 'coefficients',
        ...parsed.data,
        residualRmsPx: null,
        terms: null,
        straightLines: null,
        notes: [],
        frameWidthPx: frameSize.width,
        frameHeightPx: frameSize.height,
      },
    });
    onClose();
  };

  return (
    <Dialog
      open
      onClose={onClose}
      title="Known lens coefficients"
      description="Brown–Conrady radial k1 and k2 about the frame centre, on the radius divided by the half-diagonal of the frame (corner = 1); a negative k1 is a barrel lens. Uncertainties are standard uncertainties (1σ)."
      size="sm"
    >
      <form onSubmit={submit} className="flex flex-col gap-3">
        <div className="grid grid-cols-2 gap-3">
          <TextField label="k1" inputMode="decimal" autoFocus required value={k1} onChange={(e) => setK1(e.target.value)} />
          <TextField label="u(k1), 1σ" inputMode="decimal" value={k1Unc} onChange={(e) => setK1Unc(e.target.value)} />
          <TextField label="k2" inputMode="decimal" value={k2} onChange={(e) => setK2(e.target.value)} />
          <TextField label="u(k2), 1σ" inputMode="decimal" value={k2Unc} onChange={(e) => setK2Unc(e.target.value)} />
        </div>
        <TextField label="Correlation of k1 and k2" inputMode="decimal" value={correlation} onChange={(e) => setCorrelation(e.target.value)} hint="From −1 to 1; 0 when the profile does not state it." />
        {error && <p role="alert" className="text-micro font-medium text-alert">{error}</p>}
        <div className="flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary">Use these coefficients</Button>
        </div>
      </form>
    </Dialog>
  );
}
