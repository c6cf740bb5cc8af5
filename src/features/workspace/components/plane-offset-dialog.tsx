import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/text-field';
import { CLICK_SIGMA_PX } from '@shared/defaults';
import type { Editor } from '../editor/editor-store';
import { readPlaneOffset } from '../editor/plane-offset-fields';
import { parseTyped } from '../editor/typed-number';
import type { CalibrationDraft, LevelUncertaintyDraft } from '../editor/types';

const shown = (v: number | undefined | null) => (v === undefined || v === null ? '' : String(v));

interface PlaneOffsetDialogProps {
  editor: Editor;
  draft: CalibrationDraft;
  onClose: () => void;
}

/**
 * Where the scale reference stood and how well the level is known: the
 * camera's distance to the flight plane and the reference's offset from it
 * (positive towards the camera), each ± a tolerance; the click σ of a level
 * line's end points, or the ± tolerance of a stated roll.
 */
export function PlaneOffsetDialog({ editor, draft, onClose }: PlaneOffsetDialogProps) {
  const o = draft.planeOffset;
  const [distance, setDistance] = useState(shown(o?.planeDistanceM));
  const [distanceTol, setDistanceTol] = useState(shown(o?.planeDistanceTolM));
  const [offset, setOffset] = useState(shown(o?.referenceOffsetM));
  const [offsetTol, setOffsetTol] = useState(shown(o?.referenceOffsetTolM));
  const levelLine = draft.level?.kind === 'line';
  const [levelValue, setLevelValue] = useState(
    shown(levelLine ? (draft.levelUncertainty?.endpointSigmaPx ?? CLICK_SIGMA_PX) : (draft.levelUncertainty?.rollTolDeg ?? 0)),
  );
  const [error, setError] = useState<string | null>(null);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const read = readPlaneOffset({ distance, distanceTol, offset, offsetTol });
    if (!read.ok) return setError(read.message);
    const v = parseTyped(levelValue);
    let levelUncertainty: LevelUncertaintyDraft;
    if (levelLine) {
      if (!(v >= 0 && v <= 50)) return setError('The level click σ must be between 0 and 50 px.');
      levelUncertainty = { endpointSigmaPx: v };
    } else {
      if (!(v >= 0 && v < 45)) return setError('The roll tolerance must be from 0 up to 45°.');
      levelUncertainty = { rollTolDeg: v };
    }
    editor.setCalibration({ planeOffset: read.offset, levelUncertainty });
    onClose();
  };

  return (
    <Dialog
      open
      onClose={onClose}
      title="Plane offset and level uncertainty"
      description="A reference nearer the camera than the flight plane looks larger: pixels per metre in the plane = at the reference × (D − δ) / D. Leave the distance empty when the reference stands in the flight plane."
      size="md"
    >
      <form onSubmit={submit} className="flex flex-col gap-3">
        <fieldset className="grid grid-cols-2 gap-3">
          <legend className="mb-1 text-micro font-medium uppercase tracking-wide text-ink-soft">Scale reference off the flight plane</legend>
          <TextField label="Camera to flight plane, D" suffix="m" inputMode="decimal" autoFocus value={distance} onChange={(e) => setDistance(e.target.value)} />
          <TextField label="Tolerance (±)" suffix="m" inputMode="decimal" value={distanceTol} onChange={(e) => setDistanceTol(e.target.value)} />
          <TextField
            label="Reference offset, δ"
            suffix="m"
            inputMode="decimal"
            value={offset}
            onChange={(e) => setOffset(e.target.value)}
            hint="Positive when the reference stood nearer the camera than the flight plane."
          />
          <TextField label="Tolerance (±)" suffix="m" inputMode="decimal" value={offsetTol} onChange={(e) => setOffsetTol(e.target.value)} />
        </fieldset>
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-micro font-medium uppercase tracking-wide text-ink-soft">Level</legend>
          {levelLine ? (
            <TextField
              label="Click σ of each level-line end"
              suffix="px"
              inputMode="decimal"
              value={levelValue}
              onChange={(e) => setLevelValue(e.target.value)}
              hint={`Standard uncertainty of one click; ${CLICK_SIGMA_PX} px is common practice for a sharp line.`}
            />
          ) : (
            <TextField
              label="Roll tolerance (±)"
              suffix="°"
              inputMode="decimal"
              value={levelValue}
              onChange={(e) => setLevelValue(e.target.value)}
              hint={draft.level ? 'How well the stated roll is known.' : 'No level line: the camera is taken as level (0°) within this tolerance.'}
            />
          )}
        </fieldset>
        {error && <p role="alert" className="text-micro font-medium text-alert">{error}</p>}
        <div className="flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary">Use these values</Button>
        </div>
      </form>
    </Dialog>
  );
}
