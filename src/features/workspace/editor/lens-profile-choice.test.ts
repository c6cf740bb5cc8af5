import { describe, expect, it } from 'vitest';
import { distort, lensModelForFrame } from '@shared/geometry/lens-distortion';
import type { LensProfile } from '@shared/schemas/lens-profiles';
import { lensOfProfile, profileFitsFrame } from './lens-profile-choice';

const profile: LensProfile = {
  id: '00000000-0000-4000-8000-0000000000aa',
  name: 'Wide action cam, 2.7K',
  cameraNote: 'Linear mode off',
  coefficients: { k1: -0.14, k2: 0.02, k1StdUnc: 0.003, k2StdUnc: 0.002, k1k2Correlation: -0.8 },
  frameWidthPx: 2704,
  frameHeightPx: 1520,
  createdAt: '2026-11-30T10:00:00Z',
  updatedAt: '2026-11-30T10:00:00Z',
};

describe('choosing a team lens profile', () => {
  it('fits frames of its shape in either orientation, not another shape', () => {
    expect(profileFitsFrame(profile, { width: 1920, height: 1080 })).toBe(true); // 16:9 like 2704×1520 (1.7789 vs 1.7778)
    expect(profileFitsFrame(profile, { width: 1080, height: 1920 })).toBe(true);
    expect(profileFitsFrame(profile, { width: 640, height: 480 })).toBe(false); // 4:3
  });

  it('carries the coefficients to the clip’s frame size: the same picture point moves by the same share of the frame', () => {
    const lens = lensOfProfile(profile, { width: 1920, height: 1080 });
    expect(lens).toMatchObject({ source: 'profile', profile: { id: profile.id, name: profile.name }, k1: -0.14, k2: 0.02, k1StdUnc: 0.003, frameWidthPx: 1920, frameHeightPx: 1080, notes: ['Linear mode off'] });
    // Normalising by the half-diagonal makes the model scale-free: a corner-ward point at the same fraction of each frame lands at the same fraction.
    const big = lensModelForFrame(2704, 1520, lens), small = lensModelForFrame(1920, 1080, lens);
    const a = distort(big, { u: 0.1 * 2704, v: 0.1 * 1520 }), b = distort(small, { u: 0.1 * 1920, v: 0.1 * 1080 });
    expect(a.u / 2704).toBeCloseTo(b.u / 1920, 3);
    expect(a.v / 1520).toBeCloseTo(b.v / 1080, 3);
  });
});
