import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../../shared/random/prng';
import { relativeGain, sampleGrid } from './brightness';
import { medianStack } from './background-model';

describe('relativeGain', () => {
  it('recovers a uniform brightness change (a flicker pulse) despite a moving object covering part of the frame', () => {
    const rand = mulberry32(3);
    const W = 200;
    const H = 120;
    const reference = Float32Array.from({ length: W * H }, () => 60 + 150 * rand());
    const frame = new Uint8Array(W * H);
    for (let i = 0; i < frame.length; i++) frame[i] = Math.round(reference[i] / 1.08);
    // A dark object over 10 % of the picture: a median ignores it, a mean would not.
    for (let i = 0; i < frame.length / 10; i++) frame[i] = 20;
    const gain = relativeGain(reference, frame, sampleGrid(W, H, 4));
    expect(gain).toBeCloseTo(1.08, 2);
  });
});

describe('medianStack', () => {
  it('keeps the static scene and drops what is at a pixel in fewer than half the frames', () => {
    const n = 4;
    const frames = Array.from({ length: 7 }, (_, k) => Uint8Array.from({ length: n }, (_, p) => (p === k % n && k < 3 ? 10 : 200)));
    const spread = new Float32Array(n);
    const bg = medianStack(frames, frames.map(() => 1), n, undefined, undefined, spread);
    expect([...bg]).toEqual([200, 200, 200, 200]);
    expect([...spread]).toEqual([0, 0, 0, 0]);
  });
});
