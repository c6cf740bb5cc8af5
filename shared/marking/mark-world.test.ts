import { describe, expect, it } from 'vitest';
import { buildCalibrationTransform } from '../geometry/calibration-transform';
import { frameTimeS } from './frame-time';
import { markTimeAndPlace } from './mark-world';

describe("markTimeAndPlace: a mark's (t, x, y)", () => {
  // 200 px per metre, origin at (100, 500), level, shot flying left (x mirrored).
  const transform = buildCalibrationTransform({
    scale: { p1: { u: 100, v: 500 }, p2: { u: 300, v: 500 }, lengthM: 1, lengthTolM: 0, endpointSigmaPx: 0 },
    origin: { u: 100, v: 500 },
    level: { kind: 'angle', rollDeg: 0 },
    downrange: 'left',
    plane: null,
  });

  it('maps pixels through the calibration and the frame through the frame-time rule (by hand: 40 px left and 100 px up at 200 px/m)', () => {
    const r = markTimeAndPlace({ frameNumber: 30, uPx: 60, vPx: 400 }, transform, (f) => frameTimeS(f, null, 120));
    expect(r.tS).toBe(0.25);
    expect(r.xM).toBeCloseTo(0.2, 12);
    expect(r.yM).toBeCloseTo(0.5, 12);
  });

  it('leaves the position unknown on an uncalibrated clip and the time unknown without a time base', () => {
    expect(markTimeAndPlace({ frameNumber: 3, uPx: 1, vPx: 2 }, null, () => null)).toEqual({ tS: null, xM: null, yM: null });
  });
});
