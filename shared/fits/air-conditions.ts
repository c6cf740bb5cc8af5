// Air density for a fit from the shot's recorded conditions, with a standard
// uncertainty propagated from how well those conditions are usually known.
import { humidAirDensityKgM3 } from '../physics/air';
import {
  STATED_AIR_DENSITY_REL_TOL,
  UNKNOWN_AIR_DENSITY_KG_M3,
  UNKNOWN_AIR_DENSITY_REL_SIGMA,
  UNKNOWN_RELATIVE_HUMIDITY_PCT,
  UNKNOWN_RELATIVE_HUMIDITY_SIGMA_PCT,
  WEATHER_READING_SIGMAS as CONDITION_SIGMAS,
} from '../defaults';
import { SEA_LEVEL_TEMPERATURE_K, ZERO_CELSIUS_K } from '../physics/constants';
import { rectangularStdUncertainty } from '../uncertainty/gum';
import { formatPressureKPa } from './format';

export interface ShotConditions {
  airTempC: number | null;
  stationPressurePa: number | null;
  relativeHumidityPct: number | null;
  /** A density stated directly (kg/m³) is used as given, like the fit command's --air-density-kgm3; absent or null: none. */
  airDensityKgM3?: number | null;
  /** Its ± tolerance, kg/m³ (rectangular); null: STATED_AIR_DENSITY_REL_TOL of the density. */
  airDensityTolKgM3?: number | null;
}

export interface AirForFit {
  densityKgM3: number;
  densitySigmaKgM3: number;
  temperatureK: number;
  source: string;
  sigmaSource: string;
}

export function airForFit(c: ShotConditions): AirForFit {
  if (c.airDensityKgM3 !== undefined && c.airDensityKgM3 !== null) {
    const tolStated = c.airDensityTolKgM3 !== undefined && c.airDensityTolKgM3 !== null;
    const tol = tolStated ? c.airDensityTolKgM3! : c.airDensityKgM3 * STATED_AIR_DENSITY_REL_TOL;
    return {
      densityKgM3: c.airDensityKgM3,
      densitySigmaKgM3: rectangularStdUncertainty(tol),
      // Mach and Reynolds numbers still want a temperature: the recorded one, else the standard atmosphere's.
      temperatureK: c.airTempC === null ? SEA_LEVEL_TEMPERATURE_K : c.airTempC + ZERO_CELSIUS_K,
      source: `stated directly on the shot: ${c.airDensityKgM3} kg/m³ (used instead of temperature, pressure and humidity)`,
      sigmaSource: tolStated
        ? `stated tolerance ±${tol} kg/m³, rectangular (GUM §4.3.7)`
        : `stated default: ±${STATED_AIR_DENSITY_REL_TOL * 100} % for a density stated without a tolerance (common practice), rectangular (GUM §4.3.7)`,
    };
  }
  if (c.airTempC === null || c.stationPressurePa === null) {
    return {
      densityKgM3: UNKNOWN_AIR_DENSITY_KG_M3,
      densitySigmaKgM3: UNKNOWN_AIR_DENSITY_KG_M3 * UNKNOWN_AIR_DENSITY_REL_SIGMA,
      temperatureK: c.airTempC === null ? SEA_LEVEL_TEMPERATURE_K : c.airTempC + ZERO_CELSIUS_K,
      source: 'US Standard Atmosphere 1976 at sea level (the shot has no air temperature and station pressure)',
      sigmaSource: 'stated default: 3 % for weather and site altitude not recorded',
    };
  }
  const rhMeasured = c.relativeHumidityPct !== null;
  const rhPct = c.relativeHumidityPct ?? UNKNOWN_RELATIVE_HUMIDITY_PCT;
  const rhSigma = rhMeasured ? CONDITION_SIGMAS.relativeHumidityPct : UNKNOWN_RELATIVE_HUMIDITY_SIGMA_PCT;
  const rho = (tC: number, p: number, rh: number) =>
    humidAirDensityKgM3({ temperatureC: tC, pressurePa: p, relativeHumidity: Math.min(1, Math.max(0, rh / 100)) });
  const value = rho(c.airTempC, c.stationPressurePa, rhPct);
  // First-order propagation with central differences; the inputs are independent.
  const dT = (rho(c.airTempC + 0.1, c.stationPressurePa, rhPct) - rho(c.airTempC - 0.1, c.stationPressurePa, rhPct)) / 0.2;
  const dP = (rho(c.airTempC, c.stationPressurePa + 10, rhPct) - rho(c.airTempC, c.stationPressurePa - 10, rhPct)) / 20;
  const h = Math.min(1, rhPct, 100 - rhPct) || 1;
  const dRh = (rho(c.airTempC, c.stationPressurePa, Math.min(100, rhPct + h)) - rho(c.airTempC, c.stationPressurePa, Math.max(0, rhPct - h))) / (2 * h);
  const sigma = Math.hypot(dT * CONDITION_SIGMAS.temperatureK, dP * CONDITION_SIGMAS.pressurePa, dRh * rhSigma);
  return {
    densityKgM3: value,
    densitySigmaKgM3: sigma,
    temperatureK: c.airTempC + ZERO_CELSIUS_K,
    source: `humid-air ideal-gas mixture (Buck 1981 vapour pressure) from ${c.airTempC} °C, ${formatPressureKPa(c.stationPressurePa)}` +
      (rhMeasured ? `, ${rhPct} %RH` : ', humidity not recorded (50 %RH assumed)'),
    sigmaSource: `propagated from ±${CONDITION_SIGMAS.temperatureK} K, ±${CONDITION_SIGMAS.pressurePa / 1000} kPa, ±${rhSigma} %RH (common practice for a field weather meter)`,
  };
}
