import { z } from 'zod';
import { shutterProblem } from '../physics/exposure-timing';
import { ExposureInput, FrameStamp } from './camera';
import { Uuid } from './common';

// Contract of the clip API (docs/clips.md). Frame numbers are source frame
// numbers, 0-based, in presentation order; times are seconds of real (capture) time.

export const ShotClipParams = z.object({ teamId: Uuid, shotId: Uuid });
export const ClipIdParams = z.object({ teamId: Uuid, clipId: Uuid });
const FrameIndex = z.coerce.number().int('must be a whole frame number').min(0, 'must be 0 or more').max(10_000_000);
export const ClipFrameImageParams = z.object({ teamId: Uuid, clipId: Uuid, frameNumber: FrameIndex });
export const ClipThumbnailParams = z.object({ teamId: Uuid, clipId: Uuid, n: z.coerce.number().int().min(0).max(999) });

/** The rate the camera recorded at, as the analyst states it (phones: 240; high-speed cameras: thousands). */
export const CaptureFps = z.coerce
  .number({ error: 'must be a number of frames per second' })
  .refine(Number.isFinite, 'must be a number')
  .refine((v) => v >= 1 && v <= 100_000, 'must be between 1 and 100000 frames per second');

/** Exposure (shutter) time of each frame, s; null: not stated (ExposureInput in camera.ts). */
const ShutterS = ExposureInput.shape.shutterS;

/** A frame cannot be exposed for longer than the time between frames (shared/physics/exposure-timing.ts). */
function shutterFitsFrameInterval(v: { shutterS?: number | null; captureFps?: number }, ctx: z.RefinementCtx) {
  if (v.shutterS === undefined || v.shutterS === null || v.captureFps === undefined) return;
  const problem = shutterProblem(v.shutterS, v.captureFps);
  if (problem) ctx.addIssue({ code: 'custom', path: ['shutterS'], message: problem });
}

/** Multipart text fields beside the `file` part of an upload (multipart sends strings; numbers are coerced). */
export const ClipUploadFields = z
  .object({
    captureFps: CaptureFps,
    inFrame: FrameIndex.optional(),
    outFrame: FrameIndex.optional(),
    /** Optional: a blank field is "not stated". */
    shutterS: z.preprocess((v) => (v === '' || v === undefined || v === null ? undefined : typeof v === 'string' ? Number(v) : v), ShutterS.unwrap().optional()),
    frameStamp: FrameStamp.optional(),
  })
  .refine((v) => v.inFrame === undefined || v.outFrame === undefined || v.inFrame <= v.outFrame, {
    message: 'inFrame must not be after outFrame',
    path: ['inFrame'],
  })
  .superRefine(shutterFitsFrameInterval);
export type ClipUploadFields = z.infer<typeof ClipUploadFields>;

export const ClipPatchBody = z
  .object({
    captureFps: CaptureFps.optional(),
    inFrame: FrameIndex.optional(),
    outFrame: FrameIndex.optional(),
    /** null clears a stated shutter time. Checked against the (new or stored) capture rate. */
    shutterS: ShutterS.optional(),
    frameStamp: FrameStamp.optional(),
  })
  .strict()
  .refine((v) => v.inFrame === undefined || v.outFrame === undefined || v.inFrame <= v.outFrame, {
    message: 'inFrame must not be after outFrame',
    path: ['inFrame'],
  })
  .superRefine(shutterFitsFrameInterval);
export type ClipPatchBody = z.infer<typeof ClipPatchBody>;

export const CLIP_STATUSES = ['queued', 'extracting', 'ready', 'failed', 'cancelled'] as const;
export type ClipStatus = (typeof CLIP_STATUSES)[number];

export const FRAME_FLAGS = ['dropped-before', 'duplicate'] as const;
export type FrameFlag = (typeof FRAME_FLAGS)[number];

export const ClipWarning = z.object({
  /** rate-differs | variable-frame-rate | dropped-frames | duplicate-frames | duplicate-upload */
  code: z.string(),
  message: z.string(),
});
export type ClipWarning = z.infer<typeof ClipWarning>;

/** A clip as the API returns it. */
export const ClipView = z.object({
  id: Uuid,
  teamId: Uuid,
  shotId: Uuid,
  originalName: z.string(),
  sha256: z.string(),
  sizeBytes: z.number(),
  codec: z.string(),
  formatName: z.string(),
  /** Coded size of the stored video. */
  width: z.number().int(),
  height: z.number().int(),
  /** Clockwise rotation applied for display; frames are served already rotated. */
  rotationDeg: z.number().int(),
  /** Size of the served frames (width and height swap at 90 and 270 degrees). */
  frameWidth: z.number().int(),
  frameHeight: z.number().int(),
  /** Rate the file plays at. */
  containerFps: z.number(),
  /** Rate the camera recorded at (stated by the analyst); frame times use it. */
  captureFps: z.number(),
  frameCount: z.number().int(),
  /** Playback duration of the file. */
  durationS: z.number(),
  variableFrameRate: z.boolean(),
  warnings: z.array(ClipWarning),
  inFrame: z.number().int(),
  outFrame: z.number().int(),
  /** Exposure (shutter) time of each frame, s; null when not stated. */
  shutterS: z.number().nullable(),
  /** Where in the exposure each frame is stamped. */
  frameStamp: FrameStamp,
  /** Seconds the fit adds to every mark time to reach mid-exposure (0 without a shutter time). */
  exposureShiftS: z.number(),
  status: z.enum(CLIP_STATUSES),
  /** 0..1 while extracting. */
  progress: z.number(),
  error: z.string().nullable(),
  /** What a queued extraction is waiting for before it can retry: 'storage' while the object store is unreachable. */
  waitingFor: z.enum(['storage']).nullable(),
  extractedCount: z.number().int(),
  thumbnailCount: z.number().int(),
  /** Another clip of the team with the same bytes, if any. */
  duplicateOf: z.object({ clipId: Uuid, shotId: Uuid, originalName: z.string() }).nullable(),
  createdBy: Uuid.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ClipView = z.infer<typeof ClipView>;

export const ClipFrameView = z.object({
  frameNumber: z.number().int(),
  /** Seconds since frame 0 in capture time. */
  tS: z.number(),
  /** Presentation timestamp in the file (playback seconds). */
  ptsS: z.number().nullable(),
  flag: z.enum(FRAME_FLAGS).nullable(),
});
export type ClipFrameView = z.infer<typeof ClipFrameView>;
