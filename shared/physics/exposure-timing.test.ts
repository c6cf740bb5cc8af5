import { describe, expect, it } from 'vitest';
import { midExposureShiftS, shiftToMidExposure, shutterProblem } from './exposure-timing';

describe('mark time shift to mid-exposure', () => {
  // A frame exposed from t to t + T has its middle at t + T/2 (stamped at the
  // start), at t (stamped in the middle), at t − T/2 (stamped at the end).
  it('start +T/2, middle 0, end −T/2', () => {
    expect(midExposureShiftS(1 / 500, 'start')).toBeCloseTo(0.001, 15);
    expect(midExposureShiftS(1 / 500, 'middle')).toBe(0);
    expect(midExposureShiftS(1 / 500, 'end')).toBeCloseTo(-0.001, 15);
  });
  it('shifts every mark by the same amount and keeps the rest of the mark', () => {
    const out = shiftToMidExposure([{ tS: 0, xM: 1 }, { tS: 1 / 240, xM: 2 }], 0.004, 'end');
    expect(out).toEqual([{ tS: -0.002, xM: 1 }, { tS: 1 / 240 - 0.002, xM: 2 }]);
  });
  it('a shutter longer than the frame interval is refused in plain words; equal is allowed', () => {
    expect(shutterProblem(1 / 100, 240)).toMatch(/longer than the 4\.17 ms between frames/);
    expect(shutterProblem(1 / 240, 240)).toBeNull();
    expect(shutterProblem(0, 240)).toMatch(/positive/);
  });
});
