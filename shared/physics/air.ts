// Properties of air needed to turn a fitted drag constant into a drag
// coefficient, and to judge whether a constant drag coefficient is plausible.
import {
  GAMMA_AIR,
  GAS_CONSTANT_USSA1976_JPerMolK,
  MOLAR_MASS_DRY_AIR_KgPerMol,
  MOLAR_MASS_WATER_KgPerMol,
  SEA_LEVEL_PRESSURE_PA,
  SEA_LEVEL_TEMPERATURE_K,
  STANDARD_GRAVITY_MPS2,
  ZERO_CELSIUS_K,
} from './constants';

/**
 * Saturation vapour pressure over liquid water, Buck (1981),
 * "New equations for computing vapor pressure and enhancement factor",
 * J. Appl. Meteorol. 20, 1527-1532: e_w = 6.1121 exp(17.502 T / (240.97 + T)) hPa,
 * T in degC. Good to about 0.05 % between -20 and +50 degC, which covers outdoor shots.
 */
export function saturationVapourPressureBuckPa(temperatureC: number): number {
  return 611.21 * Math.exp((17.502 * temperatureC) / (240.97 + temperatureC));
}

/**
 * Buck (1981) enhancement factor for water vapour in moist air,
 * f = 1.0007 + 3.46e-6 P (P in hPa): real air holds slightly more vapour than
 * the pure-water value because of the other gases present.
 */
export function enhancementFactorBuck(pressurePa: number): number {
  return 1.0007 + 3.46e-6 * (pressurePa / 100);
}

export interface HumidAirInput {
  temperatureC: number;
  /** Station (absolute, not sea-level-reduced) pressure. */
  pressurePa: number;
  /** Relative humidity as a fraction 0..1. */
  relativeHumidity: number;
}

/**
 * Density of humid air treated as an ideal-gas mixture of dry air and water
 * vapour: rho = (p_d M_d + p_v M_v) / (R T). Water vapour is lighter than dry
 * air, so humid air is less dense at the same temperature and pressure.
 * The ideal-gas treatment ignores the compressibility factor (about 0.9996 near
 * room conditions), a 0.04 % effect that is far below launch-test uncertainty.
 */
export function humidAirDensityKgM3(input: HumidAirInput): number {
  const { temperatureC, pressurePa, relativeHumidity } = input;
  if (!(relativeHumidity >= 0 && relativeHumidity <= 1)) {
    throw new RangeError('relativeHumidity must be a fraction between 0 and 1');
  }
  if (!(pressurePa > 0)) throw new RangeError('pressurePa must be positive');
  const temperatureK = temperatureC + ZERO_CELSIUS_K;
  if (!(temperatureK > 0)) throw new RangeError('temperature below absolute zero');
  const vapourPa =
    relativeHumidity * enhancementFactorBuck(pressurePa) * saturationVapourPressureBuckPa(temperatureC);
  const dryPa = pressurePa - vapourPa;
  return (
    (dryPa * MOLAR_MASS_DRY_AIR_KgPerMol + vapourPa * MOLAR_MASS_WATER_KgPerMol) /
    (GAS_CONSTANT_USSA1976_JPerMolK * temperatureK)
  );
}

/** Density of dry air from the ideal-gas law. */
export function dryAirDensityKgM3(temperatureK: number, pressurePa: number): number {
  return (pressurePa * MOLAR_MASS_DRY_AIR_KgPerMol) / (GAS_CONSTANT_USSA1976_JPerMolK * temperatureK);
}

/** Earth radius used by US Standard Atmosphere 1976 to convert geometric to geopotential height (m). */
const EARTH_RADIUS_USSA1976_M = 6356766;
/** Tropospheric lapse rate, US Standard Atmosphere 1976 (K/m). */
const TROPOSPHERE_LAPSE_K_PER_M = -0.0065;
/** Top of the first layer (geopotential m); above it the temperature is constant and this model stops. */
const TROPOPAUSE_GEOPOTENTIAL_M = 11000;

export interface StandardAtmosphere {
  temperatureK: number;
  pressurePa: number;
  densityKgM3: number;
  speedOfSoundMps: number;
  dynamicViscosityPaS: number;
}

/**
 * US Standard Atmosphere 1976, troposphere only (geometric altitude up to
 * about 11 km). Launch sites sit well inside this layer, so the upper layers
 * are deliberately not modelled; altitudes above the tropopause throw.
 */
export function standardAtmosphere1976(altitudeM: number): StandardAtmosphere {
  const geopotentialM = (EARTH_RADIUS_USSA1976_M * altitudeM) / (EARTH_RADIUS_USSA1976_M + altitudeM);
  if (!(geopotentialM <= TROPOPAUSE_GEOPOTENTIAL_M && geopotentialM > -5000)) {
    throw new RangeError('standardAtmosphere1976 covers the troposphere only (-5 km to 11 km)');
  }
  const temperatureK = SEA_LEVEL_TEMPERATURE_K + TROPOSPHERE_LAPSE_K_PER_M * geopotentialM;
  const exponent =
    (STANDARD_GRAVITY_MPS2 * MOLAR_MASS_DRY_AIR_KgPerMol) /
    (GAS_CONSTANT_USSA1976_JPerMolK * TROPOSPHERE_LAPSE_K_PER_M);
  const pressurePa = SEA_LEVEL_PRESSURE_PA * Math.pow(temperatureK / SEA_LEVEL_TEMPERATURE_K, -exponent);
  return {
    temperatureK,
    pressurePa,
    densityKgM3: dryAirDensityKgM3(temperatureK, pressurePa),
    speedOfSoundMps: speedOfSoundMps(temperatureK),
    dynamicViscosityPaS: sutherlandViscosityPaS(temperatureK),
  };
}

/**
 * Dynamic viscosity of air by Sutherland's law with the US Standard
 * Atmosphere 1976 constants: mu = beta T^1.5 / (T + S),
 * beta = 1.458e-6 kg/(m s K^0.5), S = 110.4 K.
 */
export function sutherlandViscosityPaS(temperatureK: number): number {
  return (1.458e-6 * Math.pow(temperatureK, 1.5)) / (temperatureK + 110.4);
}

/** Speed of sound in dry air as an ideal gas, a = sqrt(gamma R T / M). */
export function speedOfSoundMps(temperatureK: number): number {
  return Math.sqrt((GAMMA_AIR * GAS_CONSTANT_USSA1976_JPerMolK * temperatureK) / MOLAR_MASS_DRY_AIR_KgPerMol);
}
