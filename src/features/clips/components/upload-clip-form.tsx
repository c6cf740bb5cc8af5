import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { CaptureFps } from '@shared/schemas/clips';
import type { ClipView } from '@shared/schemas/clips';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { ProgressBar } from '@/components/ui/progress-bar';
import { TextField } from '@/components/ui/text-field';
import { formatBytes } from '@/lib/format';
import { useUploadClip } from '@/api/clips/upload-clip';

// The form's own schema: the shared capture-rate rule plus the optional range,
// where an empty box means "from the first / to the last frame".
const OptionalFrame = z.preprocess(
  (v) => (v === '' || v === null || v === undefined ? undefined : v),
  z.coerce.number({ error: 'must be a whole frame number' }).int('must be a whole frame number').min(0, 'must be 0 or more').optional(),
);
const UploadFields = z
  .object({ captureFps: CaptureFps, inFrame: OptionalFrame, outFrame: OptionalFrame })
  .refine((v) => v.inFrame === undefined || v.outFrame === undefined || v.inFrame <= v.outFrame, { message: 'must not be after the last frame', path: ['inFrame'] });

const FILE_TYPES = 'video/mp4,video/quicktime,video/x-matroska,video/webm,video/x-msvideo,.mp4,.mov,.mkv,.webm,.avi';

export function UploadClipForm({ teamId, shotId, onUploaded }: { teamId: string; shotId: string; onUploaded: (clip: ClipView) => void }) {
  const upload = useUploadClip(teamId, shotId);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const { register, handleSubmit, formState, reset } = useForm<z.input<typeof UploadFields>, unknown, z.output<typeof UploadFields>>({
    resolver: zodResolver(UploadFields),
    defaultValues: { captureFps: '', inFrame: '', outFrame: '' },
  });

  const submit = handleSubmit(async (values) => {
    if (!file) {
      setFileError('Choose the clip file to upload');
      return;
    }
    try {
      const clip = await upload.mutateAsync({ file, ...values });
      reset();
      setFile(null);
      onUploaded(clip);
    } catch {
      // Shown below from upload.error.
    }
  });

  const cancelled = upload.error instanceof DOMException && upload.error.name === 'AbortError';
  const uploading = upload.isPending;
  const sent = upload.progress;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Upload a clip">
      <TextField
        label="Clip file"
        type="file"
        accept={FILE_TYPES}
        required
        disabled={uploading}
        error={fileError}
        hint={file ? `${file.name}, ${formatBytes(file.size)}` : 'MP4, MOV, MKV, WebM or AVI, straight from the camera.'}
        className="py-1.5"
        onChange={(e) => {
          setFile(e.target.files?.[0] ?? null);
          setFileError(undefined);
          upload.reset();
        }}
      />
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label="Capture frame rate"
          suffix="fps"
          inputMode="decimal"
          required
          disabled={uploading}
          error={formState.errors.captureFps?.message}
          fieldClassName="sm:col-span-1"
          {...register('captureFps')}
        />
        <TextField label="First frame" hint="Optional, 0-based" inputMode="numeric" disabled={uploading} error={formState.errors.inFrame?.message} {...register('inFrame')} />
        <TextField label="Last frame" hint="Optional, inclusive" inputMode="numeric" disabled={uploading} error={formState.errors.outFrame?.message} {...register('outFrame')} />
      </div>
      <p className="text-micro text-ink-soft">
        State the rate the camera <em>recorded</em> at. Slow-motion and high-speed files usually play back at 30 fps while they were captured at 240 fps or more;
        every frame time, and so every speed Arcbench measures, comes from this number. A wrong rate makes every speed wrong by the same factor.
      </p>
      {uploading && sent && (
        <ProgressBar
          label="Uploading"
          value={sent.totalBytes > 0 ? sent.sentBytes / sent.totalBytes : null}
          detail={`${formatBytes(sent.sentBytes)} of ${formatBytes(sent.totalBytes)}`}
        />
      )}
      {cancelled ? (
        <p role="status" className="text-body text-ink-soft">
          Upload cancelled; nothing was stored.
        </p>
      ) : (
        <UploadError error={upload.error} />
      )}
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={uploading}>
          {uploading ? 'Uploading…' : 'Upload clip'}
        </Button>
        {uploading && (
          <Button variant="ghost" onClick={upload.cancel}>
            Cancel upload
          </Button>
        )}
      </div>
    </form>
  );
}

/** A rejected file: the server's reason first, then what to try. */
function UploadError({ error }: { error: unknown }) {
  if (!error) return null;
  return (
    <div className="flex flex-col gap-1">
      <FormError error={error} />
      <p className="text-micro text-ink-faint">Nothing was stored from this attempt. Fix the file or the fields and upload again.</p>
    </div>
  );
}
