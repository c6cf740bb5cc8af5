import { describe, expect, it } from 'vitest';
import {
  dryAirDensityKgM3, humidAirDensityKgM3, saturationVapourPressureBuckPa, speedOfSoundMps,
  standardAtmosphere1976, sutherlandViscosityPaS,
} from './air';

describe('air properties', () => {
  it('sea level matches US Standard Atmosphere 1976: 1.2250 kg/m3, 340.29 m/s, 101325 Pa, 288.15 K', () => {
    // Source: U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), sea-level table values.
    const sl = standardAtmosphere1976(0);
    expect(sl.pressurePa).toBeCloseTo(101325, 6);
    expect(sl.temperatureK).toBeCloseTo(288.15, 10);
    expect(sl.densityKgM3).toBeCloseTo(1.225, 4);
    expect(sl.speedOfSoundMps).toBeCloseTo(340.29, 2);
  });

  it('1000 m matches US Standard Atmosphere 1976: 1.1117 kg/m3, 89875 Pa, 281.65 K', () => {
    // Source: U.S. Standard Atmosphere, 1976, table at 1000 m geometric altitude.
    const a = standardAtmosphere1976(1000);
    expect(a.densityKgM3).toBeCloseTo(1.1117, 4);
    expect(a.pressurePa / 89876).toBeCloseTo(1, 4);
    expect(a.temperatureK).toBeCloseTo(281.651, 3);
  });

  it('refuses altitudes above the troposphere it models', () => {
    expect(() => standardAtmosphere1976(12000)).toThrow(RangeError);
  });

  it('Sutherland viscosity at 15 degC is 1.7894e-5 Pa s', () => {
    // Source: U.S. Standard Atmosphere, 1976, sea-level dynamic viscosity 1.7894e-5 Pa s.
    expect(sutherlandViscosityPaS(288.15) / 1.7894e-5).toBeCloseTo(1, 4);
  });

  it('speed of sound at 0 degC is about 331.3 m/s', () => {
    // Source: common physics tables (from memory): 331.3 m/s in dry air at 0 degC.
    expect(speedOfSoundMps(273.15)).toBeCloseTo(331.3, 1);
  });

  it('Buck (1981) saturation vapour pressure at 20 degC is about 2.338 kPa', () => {
    // Source: from memory of Buck's table / steam tables: 2.3389 kPa at 20 degC; 0.6112 kPa at 0 degC.
    // Buck states about 0.05 % accuracy for this form; we allow 0.1 %.
    expect(Math.abs(saturationVapourPressureBuckPa(20) / 2338.8 - 1)).toBeLessThan(1e-3);
    expect(saturationVapourPressureBuckPa(0)).toBeCloseTo(611.21, 2);
    expect(saturationVapourPressureBuckPa(100) / 101325).toBeCloseTo(1, 1); // boils near 1 atm (within ~3 %)
  });

  it('humid air: lighter than dry air, 1.1989 kg/m3 at 20 degC, 101325 Pa, 50 % RH', () => {
    // Source: CIPM-2007 humid-air equation (Picard et al., Metrologia 45, 149, 2008);
    // value at 20 degC / 101325 Pa / 50 % RH from memory of common tables: 1.1989 kg/m3 (+-0.1 %).
    const humid = humidAirDensityKgM3({ temperatureC: 20, pressurePa: 101325, relativeHumidity: 0.5 });
    const dry = humidAirDensityKgM3({ temperatureC: 20, pressurePa: 101325, relativeHumidity: 0 });
    expect(humid).toBeLessThan(dry);
    expect(humid / 1.1989).toBeCloseTo(1, 3);
    // Dry air at 20 degC, 101325 Pa: 1.2041 kg/m3 (common tables, from memory).
    expect(dry / 1.2041).toBeCloseTo(1, 3);
    expect(dryAirDensityKgM3(293.15, 101325)).toBeCloseTo(dry, 12);
  });

  it('rejects a relative humidity given in percent', () => {
    expect(() => humidAirDensityKgM3({ temperatureC: 20, pressurePa: 101325, relativeHumidity: 50 })).toThrow(RangeError);
  });
});
