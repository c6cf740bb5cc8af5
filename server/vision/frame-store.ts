// Frames read from a FrameSource, kept in a small cache: the tracker looks a
// few frames back and forth and the background model re-reads its samples.
import type { FrameSource, GrayFrame } from './types';

export class FrameStore {
  private readonly cache = new Map<number, GrayFrame>();

  constructor(
    readonly source: FrameSource,
    private readonly capacity = 40,
    private readonly signal?: AbortSignal,
  ) {}

  get width() {
    return this.source.width;
  }

  get height() {
    return this.source.height;
  }

  async get(frameNumber: number): Promise<GrayFrame> {
    throwIfAborted(this.signal);
    const hit = this.cache.get(frameNumber);
    if (hit) {
      // Refresh its place in the insertion order (least recently used goes first).
      this.cache.delete(frameNumber);
      this.cache.set(frameNumber, hit);
      return hit;
    }
    const frame = await this.source.read(frameNumber);
    throwIfAborted(this.signal);
    if (frame.width !== this.source.width || frame.height !== this.source.height || frame.data.length < frame.width * frame.height) {
      throw new Error(`frame ${frameNumber} is ${frame.width}×${frame.height}, the clip is ${this.source.width}×${this.source.height}`);
    }
    this.cache.set(frameNumber, frame);
    while (this.cache.size > this.capacity) this.cache.delete(this.cache.keys().next().value as number);
    return frame;
  }
}

export class AutoMarkAbortError extends Error {
  override readonly name = 'AbortError';
  constructor() {
    super('auto-marking was cancelled');
  }
}

export function throwIfAborted(signal?: AbortSignal) {
  if (signal?.aborted) throw new AutoMarkAbortError();
}
