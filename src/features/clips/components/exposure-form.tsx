import { useState } from 'react';
import { FRAME_STAMP_POSITIONS, shutterProblem, type FrameStampPosition } from '@shared/physics/exposure-timing';
import type { ClipView } from '@shared/schemas/clips';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { useUpdateClip } from '@/api/clips/update-clip';

const STAMP_LABELS: Record<FrameStampPosition, string> = { start: 'Start', middle: 'Middle', end: 'End' };

/** "1/1000" or "0.5" (ms): cameras state shutter speeds as fractions of a second, people also type milliseconds. */
export function parseShutterS(text: string): number | null | 'invalid' {
  const t = text.trim();
  if (t === '') return null;
  const fraction = /^1\s*\/\s*(\d+(?:\.\d+)?)$/.exec(t);
  if (fraction) return Number(fraction[1]) > 0 ? 1 / Number(fraction[1]) : 'invalid';
  const ms = Number(t.replace(',', '.'));
  return Number.isFinite(ms) && ms > 0 ? ms / 1000 : 'invalid';
}

/**
 * The clip's exposure timing: its shutter time and where in the exposure the
 * camera stamps each frame. The fit moves mark times to mid-exposure, where a
 * blurred projectile's centre is.
 */
export function ExposureForm({ teamId, clip, onDone }: { teamId: string; clip: ClipView; onDone: () => void }) {
  const update = useUpdateClip(teamId);
  const [shutterText, setShutterText] = useState(clip.shutterS === null ? '' : String(+(clip.shutterS * 1000).toPrecision(6)));
  const [stamp, setStamp] = useState<FrameStampPosition>(clip.frameStamp);
  const [problem, setProblem] = useState<string | null>(null);

  async function save(e: React.FormEvent) {
    e.preventDefault();
    const shutterS = parseShutterS(shutterText);
    if (shutterS === 'invalid') return setProblem('Type the shutter time in milliseconds (e.g. 0.5) or as a fraction of a second (e.g. 1/2000).');
    const tooLong = shutterS === null ? null : shutterProblem(shutterS, clip.captureFps);
    if (tooLong) return setProblem(tooLong);
    setProblem(null);
    try {
      await update.mutateAsync({ clipId: clip.id, body: { shutterS, frameStamp: stamp } });
      onDone();
    } catch {
      // Shown by FormError from update.error; the form stays open with the values.
    }
  }

  return (
    <form onSubmit={save} noValidate className="flex flex-col gap-3 rounded-md border border-line bg-paper p-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Shutter time"
          suffix="ms"
          inputMode="decimal"
          value={shutterText}
          onChange={(e) => setShutterText(e.target.value)}
          hint="Empty: not known. 1/2000 is read as a fraction of a second."
          error={problem ?? undefined}
        />
        <SegmentedControl
          label="Frame time stamped at the exposure’s"
          showLabel
          options={FRAME_STAMP_POSITIONS.map((p) => ({ value: p, label: STAMP_LABELS[p] }))}
          value={stamp}
          onChange={setStamp}
        />
      </div>
      <p className="text-micro text-ink-faint">
        A blurred projectile’s centre is where it was at mid-exposure; the fit moves every mark time there. Most cameras do not say where they
        stamp: middle moves nothing.
      </p>
      <FormError error={update.error} />
      <div className="flex gap-2">
        <Button type="submit" size="sm" variant="primary" busy={update.isPending}>
          Save
        </Button>
        <Button size="sm" variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
