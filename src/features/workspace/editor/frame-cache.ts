// Decoded frames kept in memory, most recently used last, so stepping to a
// neighbouring frame shows it at once instead of waiting for the network and
// the JPEG decoder. Loading goes through an injected loader so the eviction
// and prefetch rules are testable without a browser.

export type FrameLoader<T> = (frameNumber: number) => Promise<T>;

export interface FrameCacheOptions {
  capacity: number;
  /** Frames to keep ready behind and ahead of the one shown (ahead matters more: people mostly step forwards). */
  behind: number;
  ahead: number;
}

export const DEFAULT_FRAME_CACHE: FrameCacheOptions = { capacity: 64, behind: 8, ahead: 24 };

export class FrameCache<T> {
  private readonly ready = new Map<number, T>();
  private readonly pending = new Map<number, Promise<T>>();
  private readonly listeners = new Set<(frameNumber: number) => void>();

  constructor(
    private readonly loader: FrameLoader<T>,
    private readonly options: FrameCacheOptions = DEFAULT_FRAME_CACHE,
  ) {}

  /** The decoded frame if it is ready (and marks it as just used), else undefined. */
  get(frameNumber: number): T | undefined {
    const item = this.ready.get(frameNumber);
    if (item !== undefined) {
      this.ready.delete(frameNumber);
      this.ready.set(frameNumber, item);
    }
    return item;
  }

  has(frameNumber: number): boolean {
    return this.ready.has(frameNumber);
  }

  /** Called with the frame number whenever a frame becomes ready. */
  onReady(listener: (frameNumber: number) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  load(frameNumber: number): Promise<T> {
    const ready = this.get(frameNumber);
    if (ready !== undefined) return Promise.resolve(ready);
    const pending = this.pending.get(frameNumber);
    if (pending) return pending;
    const promise = this.loader(frameNumber).then(
      (item) => {
        this.pending.delete(frameNumber);
        this.ready.set(frameNumber, item);
        this.evict();
        for (const l of this.listeners) l(frameNumber);
        return item;
      },
      (err) => {
        this.pending.delete(frameNumber);
        throw err;
      },
    );
    this.pending.set(frameNumber, promise);
    return promise;
  }

  /**
   * Loads the shown frame first, then its neighbours nearest first, ahead
   * before behind at equal distance. `frameNumbers` is the clip's ordered list.
   */
  prefetchAround(frameNumbers: readonly number[], index: number): void {
    const order: number[] = [];
    const reach = Math.max(this.options.ahead, this.options.behind);
    for (let d = 0; d <= reach; d++) {
      if (d <= this.options.ahead && index + d < frameNumbers.length) order.push(frameNumbers[index + d]);
      if (d > 0 && d <= this.options.behind && index - d >= 0) order.push(frameNumbers[index - d]);
    }
    for (const n of order) if (!this.ready.has(n)) this.load(n).catch(() => undefined);
  }

  private evict(): void {
    while (this.ready.size > this.options.capacity) {
      const oldest = this.ready.keys().next().value as number;
      this.ready.delete(oldest);
    }
  }
}

/** Browser loader: fetch through an <img>, then decode() so the first paint does not stall on JPEG decoding. */
export function imageLoader(urlOf: (frameNumber: number) => string): FrameLoader<HTMLImageElement> {
  return async (frameNumber) => {
    const img = new Image();
    img.decoding = 'async';
    img.src = urlOf(frameNumber);
    await img.decode();
    return img;
  };
}
