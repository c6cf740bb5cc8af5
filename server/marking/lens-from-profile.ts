// A calibration that names a team lens profile gets the profile's coefficients
// copied in (a later edit of the profile must not change a calibration version),
// provided the profile was measured on a frame of the clip's shape: the
// coefficients act on the radius normalised by the half-diagonal, so they carry
// over to any frame size of the same aspect ratio, in either orientation (the
// model is radial), and to no other.
import { and, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { FrameSize } from '../../shared/geometry/plumb-line-fit';
import { GeometryError } from '../../shared/geometry/points';
import type { LensInput } from '../../shared/schemas/camera';
import type { Db } from '../db/client';
import { lensProfiles } from '../db/schema/records';

type LensBody = z.output<typeof LensInput>;

/** Aspect ratios closer than this (relative) count as the same frame shape: 1920×1080 and 1280×720 are the same, 4:3 is not. */
const ASPECT_TOLERANCE = 0.01;

export interface ResolvedLens {
  input: LensBody | null;
  profile: { id: string; name: string } | null;
}

export async function resolveLensProfile(db: Db, teamId: string, lens: LensBody | null, frame: FrameSize): Promise<ResolvedLens> {
  if (!lens?.profileId) return { input: lens, profile: null };
  const [p] = await db.select().from(lensProfiles).where(and(eq(lensProfiles.teamId, teamId), eq(lensProfiles.id, lens.profileId)));
  if (!p) throw new GeometryError('There is no lens profile with this id in the team.', 'lens.profileId');
  const shape = (w: number, h: number) => Math.max(w, h) / Math.min(w, h);
  const profileShape = shape(p.frameWidthPx, p.frameHeightPx);
  const clipShape = shape(frame.widthPx, frame.heightPx);
  if (Math.abs(profileShape / clipShape - 1) > ASPECT_TOLERANCE) {
    throw new GeometryError(
      `The lens profile “${p.name}” was measured on ${p.frameWidthPx}×${p.frameHeightPx} frames, whose shape differs from this clip’s ` +
        `${frame.widthPx}×${frame.heightPx}; its coefficients do not carry over (a different crop of the sensor). Measure this mode’s lens instead.`,
      'lens.profileId',
    );
  }
  return { input: { coefficients: p.coefficients }, profile: { id: p.id, name: p.name } };
}
