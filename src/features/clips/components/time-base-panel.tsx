import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ClipPatchBody, type ClipFrameView, type ClipView } from '@shared/schemas/clips';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { TextField } from '@/components/ui/text-field';
import { formatNumber, formatQuantity } from '@/lib/format';
import { useUpdateClip } from '@/api/clips/update-clip';
import { ExposureForm } from './exposure-form';

/** Rates closer than this are the same rate written two ways (e.g. 29.97 vs 30000/1001). */
const SAME_RATE_TOLERANCE = 0.005;

/** Frame rates read best without padding zeros: "30 fps", "29.97 fps", "240 fps". */
function fps(value: number): string {
  return formatQuantity(value, 'fps', { decimals: 3, trim: true });
}

export function rateDiffers(clip: Pick<ClipView, 'containerFps' | 'captureFps'>): boolean {
  return Math.abs(clip.containerFps - clip.captureFps) / clip.captureFps > SAME_RATE_TOLERANCE;
}

/**
 * What the file says about time against what the analyst stated. Frame times
 * (and so every speed) come from the capture rate, so a mismatch is shown loudly.
 */
export function TimeBasePanel({ teamId, clip, frames, canEdit }: { teamId: string; clip: ClipView; frames: ClipFrameView[] | undefined; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const [editingExposure, setEditingExposure] = useState(false);
  const dropped = frames?.filter((f) => f.flag === 'dropped-before').length;
  const duplicates = frames?.filter((f) => f.flag === 'duplicate').length;
  const differs = rateDiffers(clip);
  const slowdown = clip.captureFps / clip.containerFps;
  // The rate mismatch and a duplicate upload have their own, fuller notes.
  const warnings = clip.warnings.filter((w) => w.code !== 'rate-differs' && w.code !== 'duplicate-upload');

  return (
    <div className="flex flex-col gap-3">
      {differs && (
        <p role="note" className="rounded-md border-2 border-signal bg-signal-light/50 px-3 py-2 text-body text-ink">
          The file plays at {fps(clip.containerFps)}, but you stated it was captured at {fps(clip.captureFps)}
          {slowdown > 1 ? ` (${formatNumber(slowdown, { decimals: 2, trim: true })}× slow motion)` : ''}. Frame times use the capture rate; check it
          against the camera’s setting.
        </p>
      )}
      <KeyValueList
        items={[
          { label: 'Capture rate (stated)', value: fps(clip.captureFps), numeric: true },
          { label: 'Container rate (file)', value: fps(clip.containerFps), numeric: true },
          { label: 'Frame interval', value: formatQuantity(1000 / clip.captureFps, 'ms', { digits: 4 }), numeric: true },
          { label: 'Frames in file', value: clip.frameCount, numeric: true },
          { label: 'Real duration', value: formatQuantity(clip.frameCount / clip.captureFps, 's', { digits: 4 }), numeric: true },
          { label: 'Playback duration', value: formatQuantity(clip.durationS, 's', { digits: 4 }), numeric: true },
          { label: 'Frame rate', value: clip.variableFrameRate ? 'variable (times from timestamps)' : 'constant' },
          { label: 'Dropped-frame gaps', value: dropped ?? '—', numeric: true },
          { label: 'Duplicated frames', value: duplicates ?? '—', numeric: true },
          { label: 'Shutter time', value: clip.shutterS === null ? 'not stated' : formatQuantity(clip.shutterS * 1000, 'ms', { digits: 3 }), numeric: true },
          { label: 'Frame stamped at', value: `${clip.frameStamp} of the exposure` },
          ...(clip.exposureShiftS !== 0
            ? [{ label: 'Mark times moved by', value: `${clip.exposureShiftS > 0 ? '+' : '−'}${formatQuantity(Math.abs(clip.exposureShiftS) * 1000, 'ms', { digits: 3 })} (to mid-exposure)`, numeric: true }]
            : []),
          { label: 'Video', value: `${clip.codec}, ${clip.frameWidth}×${clip.frameHeight}${clip.rotationDeg ? `, turned ${clip.rotationDeg}°` : ''}`, numeric: true },
        ]}
      />
      {warnings.length > 0 && (
        <ul className="flex flex-col gap-1" aria-label="Time-base warnings">
          {warnings.map((w) => (
            <li key={w.code + w.message} className="rounded-md border border-signal/50 bg-signal-light/30 px-3 py-1.5 text-micro text-ink">
              {w.message}
            </li>
          ))}
        </ul>
      )}
      {canEdit && !editing && !editingExposure && (
        <div className="flex flex-wrap gap-2">
          <Button size="sm" variant="ghost" onClick={() => setEditing(true)}>
            Change capture rate or range
          </Button>
          <Button size="sm" variant="ghost" onClick={() => setEditingExposure(true)}>
            Set shutter time and frame stamp
          </Button>
        </div>
      )}
      {canEdit && editing && <ClipSettingsForm teamId={teamId} clip={clip} onDone={() => setEditing(false)} />}
      {canEdit && editingExposure && <ExposureForm teamId={teamId} clip={clip} onDone={() => setEditingExposure(false)} />}
    </div>
  );
}

function ClipSettingsForm({ teamId, clip, onDone }: { teamId: string; clip: ClipView; onDone: () => void }) {
  const update = useUpdateClip(teamId);
  const { register, handleSubmit, formState } = useForm<z.input<typeof ClipPatchBody>, unknown, z.output<typeof ClipPatchBody>>({
    resolver: zodResolver(ClipPatchBody),
    defaultValues: { captureFps: clip.captureFps, inFrame: clip.inFrame, outFrame: clip.outFrame },
  });
  const submit = handleSubmit(async (values) => {
    // Send only what changed: a new range re-extracts, a new rate only recomputes times.
    const body: z.output<typeof ClipPatchBody> = {};
    if (values.captureFps !== clip.captureFps) body.captureFps = values.captureFps;
    if (values.inFrame !== clip.inFrame) body.inFrame = values.inFrame;
    if (values.outFrame !== clip.outFrame) body.outFrame = values.outFrame;
    try {
      if (Object.keys(body).length > 0) await update.mutateAsync({ clipId: clip.id, body });
      onDone();
    } catch {
      // Shown by FormError from update.error; the form stays open with the values.
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-md border border-line bg-paper p-3">
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField label="Capture frame rate" suffix="fps" inputMode="decimal" error={formState.errors.captureFps?.message} {...register('captureFps')} />
        <TextField label="First frame" inputMode="numeric" error={formState.errors.inFrame?.message} {...register('inFrame')} />
        <TextField label="Last frame" inputMode="numeric" hint={`File has 0–${clip.frameCount - 1}`} error={formState.errors.outFrame?.message} {...register('outFrame')} />
      </div>
      <p className="text-micro text-ink-faint">A new rate recomputes every frame time. A new range extracts the frames again.</p>
      <FormError error={update.error} />
      <div className="flex gap-2">
        <Button type="submit" size="sm" variant="primary" busy={formState.isSubmitting}>
          Save
        </Button>
        <Button size="sm" variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
