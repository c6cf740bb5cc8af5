import { Readable } from 'node:stream';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import type { Storage } from '../storage/storage';
import { storageFrameSource } from './frame-source';

const W = 48;
const H = 32;

/** A smooth gradient with a dark square: easy for JPEG to keep (a few grey levels at quality 100, common practice). */
function picture(frame: number): Uint8Array {
  const px = new Uint8Array(W * H);
  for (let v = 0; v < H; v++) for (let u = 0; u < W; u++) px[v * W + u] = 60 + 3 * u + v;
  for (let v = 10; v < 18; v++) for (let u = 4 + frame; u < 12 + frame; u++) px[v * W + u] = 20;
  return px;
}

async function jpegOf(px: Uint8Array, colour: boolean): Promise<Buffer> {
  const img = sharp(Buffer.from(px), { raw: { width: W, height: H, channels: 1 } });
  return (colour ? img.toColourspace('srgb') : img).jpeg({ quality: 100, chromaSubsampling: '4:4:4' }).toBuffer();
}

function memoryStorage(objects: Map<string, Buffer>, reads: string[]): Storage {
  return {
    get: async (key: string) => {
      reads.push(key);
      const body = objects.get(key);
      if (!body) throw new Error(`no object ${key}`);
      return Readable.from([body]);
    },
  } as unknown as Storage;
}

describe('storageFrameSource', () => {
  it('decodes stored JPEG frames (grey or colour) to 8-bit luma of the right size', async () => {
    const objects = new Map<string, Buffer>();
    const keys = new Map<number, string>();
    for (const n of [3, 4, 5]) {
      const key = `teams/t/clips/c/v-1/frames/${String(n).padStart(6, '0')}.jpg`;
      objects.set(key, await jpegOf(picture(n), n === 4));
      keys.set(n, key);
    }
    const reads: string[] = [];
    const source = await storageFrameSource(memoryStorage(objects, reads), { keys, frameCount: 6 });
    expect([source.frameCount, source.width, source.height]).toEqual([6, W, H]);
    for (const n of [3, 4, 5]) {
      const frame = await source.read(n);
      expect(frame.frameNumber).toBe(n);
      expect(frame.data.length).toBe(W * H);
      const truth = picture(n);
      let worst = 0;
      for (let i = 0; i < truth.length; i++) worst = Math.max(worst, Math.abs(frame.data[i] - truth[i]));
      expect(worst).toBeLessThanOrEqual(4);
    }
  });

  it('reads each frame once while it stays in the cache, and refuses frames that were not extracted', async () => {
    const objects = new Map([['k0', await jpegOf(picture(0), false)], ['k1', await jpegOf(picture(1), false)]]);
    const reads: string[] = [];
    let signs = 0;
    const source = await storageFrameSource(memoryStorage(objects, reads), { keys: new Map([[0, 'k0'], [1, 'k1']]), frameCount: 2 }, { onRead: () => signs++ });
    await source.read(1);
    await source.read(1);
    await source.read(0);
    expect(reads).toEqual(['k0', 'k1']);
    expect(signs).toBe(2);
    await expect(source.read(7)).rejects.toThrow(/not extracted/);
  });
});
