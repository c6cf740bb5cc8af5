import { describe, expect, it } from 'vitest';
import { ballisticCoefficientKgM2, checkFlow, reynoldsNumber } from './derived';
import { HANDBOOK_DRAG } from './handbook-drag';
import { sutherlandViscosityPaS } from './air';

describe('derived numbers and cautions', () => {
  it('Reynolds number rho v d / mu and ballistic coefficient m / (Cd A), by hand', () => {
    // 1.225 * 30 * 0.065 / 1.7894e-5 = 1.3349e5
    expect(reynoldsNumber(30, 0.065, 1.225, 1.7894e-5) / 1.3349e5).toBeCloseTo(1, 4);
    // 0.058 / (0.47 * pi * 0.065^2 / 4) = 37.19 kg/m^2
    expect(ballisticCoefficientKgM2(0.058, 0.47, 0.065)).toBeCloseTo(37.19, 2);
  });

  it('no cautions for a slow small ball; compressibility above Mach 0.6; drag-crisis window 2e5-5e5', () => {
    const mu = sutherlandViscosityPaS(288.15);
    const base = { diameterM: 0.04, airDensityKgM3: 1.225, viscosityPaS: mu, speedOfSoundMps: 340.29 };
    expect(checkFlow({ ...base, speedMinMps: 10, speedMaxMps: 20 }).cautions).toEqual([]);
    const fast = checkFlow({ ...base, speedMinMps: 150, speedMaxMps: 220 });
    expect(fast.machMax).toBeCloseTo(220 / 340.29, 12);
    expect(fast.cautions.some((c) => /compressibility/.test(c))).toBe(true);
    const crisis = checkFlow({ ...base, diameterM: 0.22, speedMinMps: 15, speedMaxMps: 25 });
    expect(crisis.reynoldsMax).toBeGreaterThan(2e5);
    expect(crisis.cautions.some((c) => /drag crisis/.test(c))).toBe(true);
  });

  it('every handbook drag value names its source', () => {
    for (const e of HANDBOOK_DRAG) {
      expect(e.source.length).toBeGreaterThan(5);
      expect(e.dragCoefficient).toBeGreaterThan(0);
    }
    expect(HANDBOOK_DRAG.find((e) => /subcritical/.test(e.body))?.source).toMatch(/Hoerner/);
  });
});
