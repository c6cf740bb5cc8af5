// Random access to a clip's extracted frames for the tracking core: JPEGs read
// through the Storage interface (local disk or an object store) and decoded
// to 8-bit luma with sharp. A small cache keeps the frames the tracker is
// likely to look at again (the current one and a few before it).
import type { Readable } from 'node:stream';
import sharp from 'sharp';
import type { Storage } from '../storage/storage';
import type { FrameSource, GrayFrame } from './vision';

export interface StoredFrameKeys {
  /** Source frame number → storage key of its JPEG. */
  keys: Map<number, string>;
  /** Frames are numbered 0 … frameCount-1; frames outside the extracted range have no key. */
  frameCount: number;
}

async function bufferOf(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : chunk);
  return Buffer.concat(chunks);
}

export async function decodeGray(jpeg: Buffer, frameNumber: number): Promise<GrayFrame> {
  const { data, info } = await sharp(jpeg).greyscale().raw().toBuffer({ resolveWithObject: true });
  if (info.channels !== 1) throw new Error(`frame ${frameNumber} decoded to ${info.channels} channels, expected 1`);
  return { frameNumber, width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.byteLength) };
}

export interface StorageFrameSourceOptions {
  /** Called on every read: the job's sign of life. */
  onRead?: (frameNumber: number) => void;
  cacheSize?: number;
}

/** Opens the source: decodes one frame to learn the picture size. */
export async function storageFrameSource(storage: Storage, frames: StoredFrameKeys, options: StorageFrameSourceOptions = {}): Promise<FrameSource> {
  const cacheSize = options.cacheSize ?? 8;
  const cache = new Map<number, Promise<GrayFrame>>();
  const load = (frameNumber: number): Promise<GrayFrame> => {
    const key = frames.keys.get(frameNumber);
    if (!key) return Promise.reject(new RangeError(`frame ${frameNumber} was not extracted`));
    options.onRead?.(frameNumber);
    return storage.get(key).then(bufferOf).then((jpeg) => decodeGray(jpeg, frameNumber));
  };
  const read = (frameNumber: number): Promise<GrayFrame> => {
    const hit = cache.get(frameNumber);
    if (hit) {
      cache.delete(frameNumber);
      cache.set(frameNumber, hit);
      return hit;
    }
    const pending = load(frameNumber);
    cache.set(frameNumber, pending);
    pending.catch(() => cache.delete(frameNumber));
    while (cache.size > cacheSize) cache.delete(cache.keys().next().value!);
    return pending;
  };
  const first = [...frames.keys.keys()].sort((a, b) => a - b)[0];
  if (first === undefined) throw new Error('the clip has no extracted frames');
  const probe = await read(first);
  return { frameCount: frames.frameCount, width: probe.width, height: probe.height, read };
}
