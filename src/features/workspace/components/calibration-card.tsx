import { useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { KeyValueList } from '@/components/ui/key-value-list';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { formatNumber, formatPercent } from '@/lib/format';
import type { Calibration } from '@shared/schemas/marking';
import { DEG_PER_RAD } from '@shared/geometry/roll-uncertainty';
import { draftToCreateBody, effectiveLevelUncertainty, sameDraft, calibrationToDraft, type TransformResult } from '../editor/calibration-geometry';
import type { Editor } from '../editor/editor-store';
import { useEditor } from '../hooks/use-editor';
import { useCreateCalibration } from '@/api/calibrations/create-calibration';
import { LensPanel } from './lens-panel';
import { PlaneOffsetDialog } from './plane-offset-dialog';

interface CalibrationCardProps {
  editor: Editor;
  teamId: string;
  clipId: string;
  saved: Calibration | null;
  transform: TransformResult;
  /** Frame size of the clip, px: the lens model's radius is normalised by its half-diagonal. */
  frameSize: { width: number; height: number };
}

/** What the calibration says now (draft or saved), what it implies, and saving it as the next version. */
export function CalibrationCard({ editor, teamId, clipId, saved, transform, frameSize }: CalibrationCardProps) {
  const [offsetOpen, setOffsetOpen] = useState(false);
  const draft = useEditor(editor, (s) => s.calibrationDraft);
  const canCalibrate = useEditor(editor, (s) => s.permissions.canCalibrate);
  const create = useCreateCalibration(teamId, clipId);
  const unsaved = saved ? !sameDraft(draft, calibrationToDraft(saved)) : draft.scale !== null || draft.origin !== null;
  const body = draftToCreateBody(draft);
  const t = transform?.ok ? transform.transform : null;
  const lengthText = draft.scale
    ? `${formatNumber(draft.scale.lengthM, { digits: 4 })} m${draft.scale.lengthTolM ? ` ± ${formatNumber(draft.scale.lengthTolM * 1000, { digits: 3 })} mm` : ''}`
    : 'not set — use the Ruler';
  const levelText = !draft.level
    ? 'not set — camera taken as level (0°)'
    : draft.level.kind === 'angle'
      ? `stated roll ${formatNumber(draft.level.rollDeg, { decimals: 2 })}°`
      : `from a level line`;
  const o = draft.planeOffset;
  const offsetText = o
    ? `reference ${formatNumber(o.referenceOffsetM, { digits: 3 })} ± ${formatNumber(o.referenceOffsetTolM, { digits: 2 })} m towards the camera, plane at ${formatNumber(o.planeDistanceM, { digits: 4 })} ± ${formatNumber(o.planeDistanceTolM, { digits: 2 })} m`
    : 'none stated — reference taken to lie in the flight plane';
  const lu = effectiveLevelUncertainty(draft);
  const levelUncText = 'endpointSigmaPx' in lu ? `level-line clicks ± ${formatNumber(lu.endpointSigmaPx, { digits: 3 })} px (1σ)` : `stated roll ± ${formatNumber(lu.rollTolDeg, { digits: 3 })}°`;

  return (
    <Card
      title="Calibration card"
      subtitle={saved ? `Saved version ${saved.version}${saved.createdBy ? ` by ${saved.createdBy.displayName}` : ''}` : 'No saved calibration yet'}
      actions={unsaved ? <Badge tone="signal">unsaved changes</Badge> : saved ? <Badge tone="fit">current</Badge> : null}
    >
      <KeyValueList
        items={[
          { label: 'Scale reference', value: lengthText },
          { label: 'Origin', value: draft.origin ? `${formatNumber(draft.origin.u, { decimals: 1 })}, ${formatNumber(draft.origin.v, { decimals: 1 })} px` : 'not set — use the Origin pin', numeric: true },
          { label: 'Level', value: levelText },
          { label: 'Plane fix', value: draft.plane ? `${draft.plane.widthM} × ${draft.plane.heightM} m rectangle` : 'none (camera square to the flight plane)' },
          { label: 'Plane offset', value: offsetText },
          { label: 'Level uncertainty', value: levelUncText },
          { label: 'Pixels per metre', value: t ? formatNumber(t.pixelsPerMetre, { digits: 5 }) : '—', numeric: true },
          { label: 'Scale uncertainty (1σ)', value: t ? formatPercent(t.scaleRelUncertainty, 2) : '—', numeric: true },
          { label: 'Camera roll used', value: t ? `${formatNumber(t.rollDeg, { decimals: 2 })}°` : '—', numeric: true },
          { label: 'Roll uncertainty (1σ)', value: t ? `${formatNumber(t.rollStdUncertaintyRad * DEG_PER_RAD, { digits: 2 })}°` : '—', numeric: true },
          ...(t?.planeOffset ? [{ label: 'Plane-offset factor (D − δ)/D', value: `${formatNumber(t.planeOffset.factor, { digits: 5 })} ± ${formatPercent(t.planeOffset.relStdUncertainty, 2)}`, numeric: true }] : []),
        ]}
      />
      {canCalibrate && (
        <Button size="sm" className="mt-2" onClick={() => setOffsetOpen(true)}>
          Plane offset and level uncertainty…
        </Button>
      )}
      {offsetOpen && <PlaneOffsetDialog editor={editor} draft={draft} onClose={() => setOffsetOpen(false)} />}
      <LensPanel editor={editor} teamId={teamId} frameSize={frameSize} saved={saved} saveError={create.error} />
      <div className="mt-3 flex flex-wrap items-center justify-between gap-2">
        <SegmentedControl
          label="Shot flies towards"
          showLabel
          size="sm"
          value={draft.downrange}
          onChange={(v) => editor.setCalibration({ downrange: v })}
          options={[
            { value: 'right', label: 'Right', disabled: !canCalibrate },
            { value: 'left', label: 'Left', disabled: !canCalibrate },
          ]}
        />
        {canCalibrate && (
          <Button
            variant="primary"
            disabled={!body || !unsaved || transform?.ok === false}
            busy={create.isPending}
            onClick={() => body && create.mutate(body, { onSuccess: (c) => editor.replaceCalibration(calibrationToDraft(c)) })}
          >
            Save as version {(saved?.version ?? 0) + 1}
          </Button>
        )}
      </div>
      {transform && !transform.ok && <p role="alert" className="mt-2 text-micro text-alert">{transform.message}</p>}
      {create.error && <p role="alert" className="mt-2 text-micro text-alert">Not saved: {create.error.message}</p>}
      {create.isSuccess && !unsaved && <p role="status" className="mt-2 text-micro text-fit-dark">Saved. World coordinates now use version {saved?.version}.</p>}
      {unsaved && saved && <p className="mt-2 text-micro text-ink-faint">World values on this page already use the unsaved draft; others see version {saved.version} until you save.</p>}
    </Card>
  );
}
