import { describe, expect, it } from 'vitest';
import { simulateTrajectory } from './flight';
import { alongPlaneWindMps, windComponents } from './wind';

describe('wind relative to the line of fire', () => {
  it('headwind (from 0°) is negative along the plane, tailwind positive, a crosswind adds nothing', () => {
    expect(alongPlaneWindMps({ speedMps: 5, fromDeg: 0 })).toBe(-5);
    expect(alongPlaneWindMps({ speedMps: 5, fromDeg: 180 })).toBeCloseTo(5, 14);
    expect(windComponents({ speedMps: 5, fromDeg: 90 })).toEqual({ alongMps: 0, crossMps: 5 });
    expect(alongPlaneWindMps(null)).toBe(0);
  });
  it('from 60° a 4 m/s wind is 2 m/s of headwind (cos 60° = 1/2)', () => {
    expect(alongPlaneWindMps({ speedMps: 4, fromDeg: 60 })).toBeCloseTo(-2, 14);
    expect(windComponents({ speedMps: 4, fromDeg: 60 }).crossMps).toBeCloseTo(2 * Math.sqrt(3), 14);
  });
  it('the flight model takes it: a vertical shot drifts downwind (relative-air drag pushes it along w)', () => {
    const launch = { xM: 0, yM: 0, vxMps: 0, vyMps: 20 };
    const calm = simulateTrajectory({ dragK_perM: 0.01 }, launch, { timesS: [0, 1] });
    const tail = simulateTrajectory({ dragK_perM: 0.01, windXMps: alongPlaneWindMps({ speedMps: 6, fromDeg: 180 }) }, launch, { timesS: [0, 1] });
    expect(calm.points[1].xM).toBe(0);
    expect(tail.points[1].xM).toBeGreaterThan(0.05);
  });
});
