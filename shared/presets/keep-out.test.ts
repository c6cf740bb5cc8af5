import { describe, expect, it } from 'vitest';
import { STANDARD_GRAVITY_MPS2 } from '../physics/constants';
import { dragKFromCd } from '../physics/flight';
import { bestElevationForRange } from '../physics/forecast';
import { adiabaticSpeed } from '../physics/launcher';
import { keepOutDistance, type KeepOutSetup } from './keep-out';
import { airDensityFor } from './preset-forecast';

const BASE: KeepOutSetup = {
  values: { dragCoefficient: 0.82, dragCoefficientStd: 0.02, efficiency: 0.05, efficiencyStd: 0.005, launcherModel: 'adiabatic' },
  safetyFactor: 1.5,
  launcher: { boreM: 0.04, barrelLengthM: 0.6, chamberVolumeM3: 0.0015, maxWorkingPressurePa: 1e6 },
  projectile: { massKg: 0.055, diameterM: 0.04 },
  air: { airTempC: 35, stationPressurePa: 95000, relativeHumidityPct: 0 },
};

describe('keep-out distance', () => {
  it('is the drag range at the bounds (η + 2σ, Cd − 2σ) times the factor, computed with the physics core', () => {
    const k = keepOutDistance(BASE);
    const model = adiabaticSpeed({ gaugePressurePa: 1e6, boreDiameterM: 0.04, barrelLengthM: 0.6, chamberVolumeM3: 0.0015, massKg: 0.055, atmosphericPressurePa: 95000 }).speedMps;
    const speed = model * Math.sqrt(0.06);
    const rho = airDensityFor(BASE.air).densityKgM3;
    const best = bestElevationForRange({ speedMps: speed, dragK_perM: dragKFromCd(0.78, 0.04, 0.055, rho) });
    expect(k.speedUpperMps).toBeCloseTo(speed, 10);
    expect(k.maxRangeM).toBeCloseTo(best.rangeM, 8);
    expect(k.keepOutM).toBeCloseTo(best.rangeM * 1.5, 8);
    // Closed form: the vacuum maximum range is v²/g at 45°.
    expect(k.vacuumCeilingM).toBeCloseTo(model ** 2 / STANDARD_GRAVITY_MPS2, 9);
    // With drag the best elevation is below 45° (common result for quadratic drag).
    expect(k.bestElevationDeg).toBeLessThan(45);
  });

  it('grows as the Cd interval widens, and as the efficiency interval widens', () => {
    const base = keepOutDistance(BASE).keepOutM;
    const widerCd = keepOutDistance({ ...BASE, values: { ...BASE.values, dragCoefficientStd: 0.1 } }).keepOutM;
    const widerEta = keepOutDistance({ ...BASE, values: { ...BASE.values, efficiencyStd: 0.02 } }).keepOutM;
    expect(widerCd).toBeGreaterThan(base);
    expect(widerEta).toBeGreaterThan(base);
  });

  it('caps the efficiency at 1 (the model bound) and keeps Cd above zero', () => {
    const k = keepOutDistance({ ...BASE, values: { ...BASE.values, efficiency: 0.9, efficiencyStd: 0.2, dragCoefficientStd: 1 } });
    expect(k.efficiencyUpper).toBe(1);
    expect(k.dragCoefficientLower).toBeGreaterThan(0);
    expect(k.maxRangeM).toBeLessThan(k.vacuumCeilingM);
  });
});
