import { describe, expect, it } from 'vitest';
import { frameTimeS } from './frame-time';

describe('frameTimeS: the one frame → time rule', () => {
  it('takes the frame table time when there is one, even if it disagrees with frame / fps (dropped frames)', () => {
    expect(frameTimeS(10, 0.05, 240)).toBe(0.05);
    expect(frameTimeS(0, 0, 240)).toBe(0);
  });

  it('falls back to frame / capture fps (closed form: frame 120 at 240 fps is 0.5 s)', () => {
    expect(frameTimeS(120, undefined, 240)).toBe(0.5);
    expect(frameTimeS(120, null, 240)).toBe(0.5);
  });

  it('is unknown without a table time and a positive capture rate', () => {
    expect(frameTimeS(5, null, 0)).toBeNull();
    expect(frameTimeS(5, undefined, null)).toBeNull();
  });
});
