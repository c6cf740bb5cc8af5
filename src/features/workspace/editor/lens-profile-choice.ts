// A team lens profile as the lens of this clip's calibration draft. The
// coefficients act on the radius over the frame's half-diagonal, so they carry
// over to any frame of the profile's shape, in either orientation (the model is
// radial), and to no other; the server refuses the rest with the same 1 %
// tolerance (server/marking/lens-from-profile.ts).
import type { LensProfile } from '@shared/schemas/lens-profiles';
import type { LensDraft } from './types';

export interface FrameSizePx {
  width: number;
  height: number;
}

const shape = (w: number, h: number) => Math.max(w, h) / Math.min(w, h);

export function profileFitsFrame(p: Pick<LensProfile, 'frameWidthPx' | 'frameHeightPx'>, frame: FrameSizePx): boolean {
  return Math.abs(shape(p.frameWidthPx, p.frameHeightPx) / shape(frame.width, frame.height) - 1) <= 0.01;
}

/** The draft's lens from a profile: its coefficients, on this clip's frame size (the same normalised radius). */
export function lensOfProfile(p: LensProfile, frame: FrameSizePx): LensDraft {
  return {
    model: 'brown-conrady-radial',
    source: 'profile',
    profile: { id: p.id, name: p.name },
    ...p.coefficients,
    residualRmsPx: null,
    terms: null,
    straightLines: null,
    notes: p.cameraNote ? [p.cameraNote] : [],
    frameWidthPx: frame.width,
    frameHeightPx: frame.height,
  };
}
