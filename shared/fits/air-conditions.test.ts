import { describe, expect, it } from 'vitest';
import { UNKNOWN_AIR_DENSITY_KG_M3 } from '../defaults';
import { airForFit } from './air-conditions';

describe('air density for a fit', () => {
  it('dry air at 20 °C and 101325 Pa is 1.2041 kg/m³', () => {
    // Ideal gas, rho = p M / (R T) with M = 28.9644 g/mol, R = 8.31432 J/(mol K) (US Standard Atmosphere 1976):
    // 101325 × 0.0289644 / (8.31432 × 293.15) = 1.20412 kg/m³. Handbook tables give 1.204 (CRC Handbook, from memory).
    const air = airForFit({ airTempC: 20, stationPressurePa: 101325, relativeHumidityPct: 0 });
    expect(air.densityKgM3).toBeCloseTo(1.20412, 4);
    expect(air.temperatureK).toBeCloseTo(293.15, 10);
  });

  it('humid air is lighter, and its uncertainty follows the stated weather-meter sigmas', () => {
    const dry = airForFit({ airTempC: 25, stationPressurePa: 100000, relativeHumidityPct: 0 });
    const humid = airForFit({ airTempC: 25, stationPressurePa: 100000, relativeHumidityPct: 100 });
    // Saturated air at 25 °C holds about 3.17 kPa of vapour (Buck 1981); water (18 g/mol) replacing air (29 g/mol)
    // lowers the density by about 3.17/100 × (1 − 18.015/28.964) = 1.2 %.
    expect(1 - humid.densityKgM3 / dry.densityKgM3).toBeCloseTo(0.012, 3);
    // 0.5 K in 298 K is 0.17 %, 50 Pa in 100 kPa is 0.05 %: together about 0.18 % of rho (first order, in quadrature).
    expect(dry.densitySigmaKgM3 / dry.densityKgM3).toBeGreaterThan(0.0017);
    expect(dry.densitySigmaKgM3 / dry.densityKgM3).toBeLessThan(0.0019);
  });

  it('without conditions falls back to the standard sea-level density with a wide sigma, and says so', () => {
    const air = airForFit({ airTempC: null, stationPressurePa: null, relativeHumidityPct: null });
    expect(air.densityKgM3).toBe(UNKNOWN_AIR_DENSITY_KG_M3); // 1.225 kg/m³, US Standard Atmosphere 1976
    expect(air.source).toMatch(/Standard Atmosphere/);
    expect(air.densitySigmaKgM3 / air.densityKgM3).toBeCloseTo(0.03, 10);
  });

  it('a density stated directly wins over the weather readings; its ± tolerance becomes u = a/√3', () => {
    // GUM JCGM 100:2008 §4.3.7: a rectangular ±a has u = a/√3; ±0.02 → 0.011547.
    const air = airForFit({ airTempC: 30, stationPressurePa: 90000, relativeHumidityPct: 80, airDensityKgM3: 1.1, airDensityTolKgM3: 0.02 });
    expect(air.densityKgM3).toBe(1.1);
    expect(air.densitySigmaKgM3).toBeCloseTo(0.011547, 6);
    expect(air.temperatureK).toBeCloseTo(303.15, 10); // the recorded temperature still sets Mach and Reynolds numbers
    expect(air.source).toMatch(/stated directly/);
  });

  it('a density stated without a tolerance takes the stated default (±1 %, rectangular) and says so', () => {
    const air = airForFit({ airTempC: null, stationPressurePa: null, relativeHumidityPct: null, airDensityKgM3: 1.2 });
    expect(air.densitySigmaKgM3).toBeCloseTo((1.2 * 0.01) / Math.sqrt(3), 12);
    expect(air.sigmaSource).toMatch(/stated default/);
  });
});
