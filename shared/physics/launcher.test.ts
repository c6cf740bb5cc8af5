import { describe, expect, it } from 'vitest';
import { adiabaticSpeed, constantPressureSpeedMps, launcherEfficiency } from './launcher';

const BASE = { gaugePressurePa: 500e3, boreDiameterM: 0.04, barrelLengthM: 1.0, massKg: 0.05 };
const AREA = (Math.PI * 0.04 ** 2) / 4;

describe('launcher models', () => {
  it('constant pressure: kinetic energy equals P_gauge A L (work-energy theorem, standard mechanics)', () => {
    const v = constantPressureSpeedMps(BASE);
    expect((0.5 * BASE.massKg * v * v) / (500e3 * AREA * 1.0)).toBeCloseTo(1, 12);
    expect(v).toBeCloseTo(158.53, 2); // sqrt(2 * 5e5 * 1.2566e-3 / 0.05), by hand
  });

  it('adiabatic model: closed form matches numerical integration of (P0 (V0/(V0+Ax))^1.4 - P_atm) A dx', () => {
    const input = { ...BASE, chamberVolumeM3: 0.5e-3, atmosphericPressurePa: 101325 };
    const r = adiabaticSpeed(input);
    // Composite Simpson rule with 2000 panels, independent of the closed form.
    const p0 = 500e3 + 101325;
    const integrand = (x: number) => (p0 * Math.pow(0.5e-3 / (0.5e-3 + AREA * x), 1.4) - 101325) * AREA;
    const m = 2000, h = 1 / m;
    let s = integrand(0) + integrand(1);
    for (let i = 1; i < m; i++) s += (i % 2 ? 4 : 2) * integrand(i * h);
    expect(r.workJ / ((s * h) / 3)).toBeCloseTo(1, 9);
    expect(r.speedMps).toBeLessThan(constantPressureSpeedMps(BASE));
  });

  it('adiabatic model tends to the constant-pressure bound as chamber volume grows', () => {
    const bound = constantPressureSpeedMps(BASE);
    let previous = 0;
    for (const v0 of [5e-4, 1e-3, 1e-2, 1, 1e3]) {
      const s = adiabaticSpeed({ ...BASE, chamberVolumeM3: v0 }).speedMps;
      expect(s).toBeGreaterThan(previous);
      expect(s).toBeLessThanOrEqual(bound);
      previous = s;
    }
    expect(previous / bound).toBeCloseTo(1, 5); // V0 = 1e3 m^3 is ~1e6 swept volumes
  });

  it('flags a small chamber whose gas falls below atmospheric before the muzzle', () => {
    const r = adiabaticSpeed({ ...BASE, gaugePressurePa: 100e3, chamberVolumeM3: 2e-4, barrelLengthM: 3 });
    expect(r.underExpanded).toBe(true);
    expect(r.muzzlePressurePa).toBeLessThan(101325);
  });

  it('efficiency is (v_measured / v_model)^2', () => {
    expect(launcherEfficiency(100 / Math.SQRT2, 100)).toBeCloseTo(0.5, 14);
    expect(launcherEfficiency(80, 100)).toBeCloseTo(0.64, 14);
  });
});
