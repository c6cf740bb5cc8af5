// Pure helpers behind stored fits: the air density a fit uses, the canonical
// JSON its input hash is taken over, the digits its numbers print with, and the
// curves the page and the PDF draw.
import { describe, expect, it } from 'vitest';
import { airForFit } from '../../../shared/fits/air-conditions';
import { UNKNOWN_AIR_DENSITY_KG_M3 } from '../../../shared/defaults';
import { dragFreePathAt, finiteDifferenceSpeeds } from '../../../shared/fits/curves';
import { decimalsFor, formatInterval } from '../../../shared/fits/format';
import { canonicalJson, inputHash } from '../../../server/fits/input-hash';
import { niceTicks } from '../../../server/fits/pdf-chart';
import type { FitShotResult } from '../../../shared/physics/types';

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
});

describe('input hash', () => {
  it('does not depend on key order, and changes with any number', () => {
    expect(canonicalJson({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe('{"a":[1,{"c":3,"d":2}],"b":1}');
    expect(inputHash({ x: 1, y: 2 })).toBe(inputHash({ y: 2, x: 1 }));
    expect(inputHash({ x: 0.1 + 0.2 })).not.toBe(inputHash({ x: 0.3 }));
    // sha256("{}") is the published digest 44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a.
    expect(inputHash({})).toBe('44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a');
  });

  it('refuses numbers JSON cannot carry', () => {
    expect(() => canonicalJson({ x: Number.NaN })).toThrow();
  });
});

describe('printed digits', () => {
  it('two significant digits of the 95 % half-width decide the decimals (GUM §7.2.6)', () => {
    expect(decimalsFor(0.12)).toBe(2);
    expect(decimalsFor(0.0095)).toBe(4);
    expect(decimalsFor(3.4)).toBe(1);
    expect(formatInterval({ value: 25.03, stdErr: 0.15, ci95: [24.727, 25.3297] })).toBe('24.73 to 25.33');
  });
});

describe('plot helpers', () => {
  it('chart ticks are round 1-2-5 steps covering the data', () => {
    expect(niceTicks(0, 6.4)).toEqual([0, 2, 4, 6, 8]);
    expect(niceTicks(-0.013, 0.021)).toEqual([-0.02, -0.01, 0, 0.01, 0.02, 0.03]);
  });

  it('the drag-free path is the closed-form parabola', () => {
    const e = (value: number) => ({ value, stdErr: 0, ci95: [value, value] as [number, number] });
    const result = { tRefS: 0.5, dragFree: { x0M: e(1), y0M: e(2), launchSpeedMps: e(20), launchAngleDeg: e(30) } } as unknown as FitShotResult;
    const [p] = dragFreePathAt(result, [1.5], 9.80665);
    // x = x0 + v cos θ τ, y = y0 + v sin θ τ − g τ²/2 with τ = 1 s.
    expect(p.xM).toBeCloseTo(1 + 20 * Math.cos(Math.PI / 6), 12);
    expect(p.yM).toBeCloseTo(2 + 10 - 9.80665 / 2, 12);
    expect(p.speedMps).toBeCloseTo(Math.hypot(20 * Math.cos(Math.PI / 6), 10 - 9.80665), 12);
  });

  it('finite-difference speeds of a uniform motion are exact', () => {
    const marks = Array.from({ length: 40 }, (_, i) => ({ tS: i / 100, xM: 3 * (i / 100), yM: 4 * (i / 100) }));
    const speeds = finiteDifferenceSpeeds(marks);
    expect(speeds.length).toBe(38); // stride 2 for 40 marks
    for (const s of speeds) expect(s.speedMps).toBeCloseTo(5, 12); // 3-4-5 triangle
  });
});
