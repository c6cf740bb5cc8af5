import { describe, expect, it } from 'vitest';
import { FrameCache } from './frame-cache';

function recordingCache(capacity = 4, behind = 1, ahead = 2) {
  const requested: number[] = [];
  const cache = new FrameCache<string>(async (n) => {
    requested.push(n);
    return `frame-${n}`;
  }, { capacity, behind, ahead });
  return { cache, requested };
}

describe('frame cache', () => {
  it('loads each frame once, however often it is asked for', async () => {
    const { cache, requested } = recordingCache();
    await Promise.all([cache.load(3), cache.load(3)]);
    await cache.load(3);
    expect(requested).toEqual([3]);
    expect(cache.get(3)).toBe('frame-3');
  });

  it('prefetches the shown frame, then nearest neighbours, ahead first', async () => {
    const { cache, requested } = recordingCache(10, 1, 2);
    cache.prefetchAround([10, 11, 12, 13, 14], 2);
    await new Promise((r) => setTimeout(r, 0));
    expect(requested).toEqual([12, 13, 11, 14]);
  });

  it('drops the least recently used frame beyond capacity', async () => {
    const { cache } = recordingCache(2);
    await cache.load(1);
    await cache.load(2);
    cache.get(1); // 1 is now the most recent
    await cache.load(3);
    expect(cache.has(1)).toBe(true);
    expect(cache.has(2)).toBe(false);
    expect(cache.has(3)).toBe(true);
  });

  it('tells listeners when a frame becomes ready', async () => {
    const { cache } = recordingCache();
    const ready: number[] = [];
    cache.onReady((n) => ready.push(n));
    await cache.load(7);
    expect(ready).toEqual([7]);
  });

  it('forgets a failed load so it can be retried', async () => {
    let fail = true;
    const cache = new FrameCache<string>(async (n) => {
      if (fail) throw new Error('offline');
      return `f${n}`;
    });
    await expect(cache.load(1)).rejects.toThrow('offline');
    fail = false;
    await expect(cache.load(1)).resolves.toBe('f1');
  });
});
