// A clip through a real camera for the camera-correction API tests: every
// effect of issue #12 at once, rendered by the clip generator with its truth
// (server/fixtures/camera-effects.ts), and the clicks a careful person makes to
// correct them (fence edges, scale bar ends, launch point, level line), each
// with seeded Gaussian click noise.
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { generateClip, presetSpec, type ClipSpec, type GeneratedClip } from '../../server/fixtures/clip-generator';
import type { PixelPoint } from '../../shared/geometry/points';
import { mulberry32, normalDeviates } from '../../shared/random/prng';

/**
 * The flight: a light 100 mm foam ball (50 g) at 20 m/s and 35°, Cd 0.47
 * (sphere at subcritical Reynolds number, common handbook value), filmed at
 * 240 fps for 0.3 s, so drag takes several m/s off inside the clip and Cd is
 * resolved to a few per cent. The camera:
 *  - a barrel lens k1 = −0.2, k2 = 0.04 on the half-diagonal radius (the size of
 *    a wide action-camera lens, from memory; not any product's profile);
 *  - rolled 2.5° (a tripod head set by eye);
 *  - the 4 m scale bar lies on the ground 0.3 m nearer the camera than the
 *    flight plane, which is 10 m away (it shows 10/9.7 = 3.1 % longer);
 *  - each frame exposed for the whole frame interval (1/240 s) and stamped at
 *    the start of its exposure, so the ball is smeared over about one diameter.
 */
export const CAMERA_CLIP: ClipSpec = presetSpec('clean', {
  name: 'camera-effects',
  width: 1280,
  height: 720,
  frameCount: 72,
  launchSpeedMps: 20,
  launchAngleDeg: 35,
  massKg: 0.05,
  diameterM: 0.1,
  pixelsPerMetre: 80,
  originPx: { u: 200, v: 560 },
  scaleLengthM: 4,
  rollDeg: 2.5,
  blurSubframes: 7,
  shutterFraction: 1,
  seed: 1207,
  camera: {
    lens: { k1: -0.2, k2: 0.04 },
    scaleBarOffset: { planeDistanceM: 10, offsetM: 0.3 },
    stamp: 'start',
    straightEdges: true,
  },
});

export async function generateCameraClip(overrides: Partial<ClipSpec> = {}): Promise<{ clip: GeneratedClip; cleanup: () => Promise<void> }> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'arcbench-camera-clip-'));
  const clip = await generateClip({ ...CAMERA_CLIP, ...overrides }, dir);
  return { clip, cleanup: () => rm(dir, { recursive: true, force: true }) };
}

/** A person's clicks: the true picture point plus N(0, σ²) on u and v, seeded. */
export function clicker(seed: number) {
  const gauss = normalDeviates(mulberry32(seed));
  return (p: PixelPoint, sigmaPx: number): PixelPoint => ({ u: p.u + sigmaPx * gauss(), v: p.v + sigmaPx * gauss() });
}
