import { z } from 'zod';
import { coefficientProblem } from '../geometry/lens-distortion';
import { LensCoefficients } from './camera';
import { Uuid } from './common';

// Team lens profiles: a lens measured once (plumb-line fit, a checkerboard, a
// maker's data sheet) and kept as a team record, so a calibration can name it
// instead of clicking straight edges again. Coefficients are Brown–Conrady k1,
// k2 on the radius normalised by the half-diagonal of the frame size the
// profile was measured at (shared/geometry/lens-distortion.ts).

export const LensProfileParams = z.object({ teamId: Uuid, profileId: Uuid });

/** Stated coefficients that also keep the picture one-to-one out to its corners (no fold, no fisheye). */
export const ProfileCoefficients = LensCoefficients.superRefine((c, ctx) => {
  const problem = coefficientProblem(c);
  if (problem) ctx.addIssue({ code: 'custom', path: ['k1'], message: problem });
});

/** A frame side in pixels: from a thumbnail-sized 16 px up to 16K video. */
const FrameSidePx = z
  .number({ error: 'must be a number of pixels' })
  .int('must be a whole number of pixels')
  .min(16, 'must be at least 16 px')
  .max(16_384, 'must be at most 16384 px');

const Name = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const CameraNote = z
  .string()
  .trim()
  .max(500, 'must be at most 500 characters')
  .nullish()
  .transform((v) => (v ? v : null));

const profileFields = {
  name: Name,
  /** Camera, lens, recording mode and zoom the coefficients belong to. */
  cameraNote: CameraNote,
  coefficients: ProfileCoefficients,
  /** Frame size the normalised radius refers to; a clip of another aspect ratio cannot use the profile. */
  frameWidthPx: FrameSidePx,
  frameHeightPx: FrameSidePx,
};

export const LensProfileCreateBody = z.object(profileFields);
export type LensProfileCreateBody = z.input<typeof LensProfileCreateBody>;

export const LensProfileUpdateBody = z
  .object(profileFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type LensProfileUpdateBody = z.input<typeof LensProfileUpdateBody>;

export const LensProfile = z.object({
  id: Uuid,
  name: z.string(),
  cameraNote: z.string().nullable(),
  coefficients: z.object({ k1: z.number(), k2: z.number(), k1StdUnc: z.number(), k2StdUnc: z.number(), k1k2Correlation: z.number() }),
  frameWidthPx: z.number().int(),
  frameHeightPx: z.number().int(),
  createdAt: z.string().describe('ISO 8601 date and time'),
  updatedAt: z.string().describe('ISO 8601 date and time'),
});
export type LensProfile = z.infer<typeof LensProfile>;
export const LensProfileList = z.array(LensProfile);
