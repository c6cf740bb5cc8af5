import { describe, expect, it } from 'vitest';
import { parseShutterS } from './exposure-form';

describe('parseShutterS', () => {
  it('reads milliseconds and camera-style fractions of a second, and empty as not stated', () => {
    expect(parseShutterS('0.5')).toBeCloseTo(0.0005, 15);
    expect(parseShutterS('0,25')).toBeCloseTo(0.00025, 15);
    // A camera's "1/2000" shutter speed is 1/2000 s = 0.5 ms.
    expect(parseShutterS(' 1/2000 ')).toBeCloseTo(0.0005, 15);
    expect(parseShutterS('')).toBeNull();
  });

  it('calls anything else invalid rather than guessing', () => {
    for (const text of ['fast', '-1', '0', '1/0', '2/1000']) expect(parseShutterS(text), text).toBe('invalid');
  });
});
