// Physical constants in SI units. Values the rest of shared/physics relies on,
// kept in one place so a test can name the source of each.

/** Standard acceleration of gravity (CGPM 1901, exact by definition). */
export const STANDARD_GRAVITY_MPS2 = 9.80665;

/** Universal gas constant as used by the US Standard Atmosphere 1976 (J/(mol K)). */
export const GAS_CONSTANT_USSA1976_JPerMolK = 8.31432;

/** Molar mass of dry air, US Standard Atmosphere 1976 (kg/mol). */
export const MOLAR_MASS_DRY_AIR_KgPerMol = 0.0289644;

/** Molar mass of water (kg/mol). */
export const MOLAR_MASS_WATER_KgPerMol = 0.01801528;

/** Ratio of specific heats for dry air (diatomic ideal gas). */
export const GAMMA_AIR = 1.4;

/** Sea-level standard pressure (Pa) and temperature (K), US Standard Atmosphere 1976. */
export const SEA_LEVEL_PRESSURE_PA = 101325;
export const SEA_LEVEL_TEMPERATURE_K = 288.15;

/** 0 degC in kelvin. */
export const ZERO_CELSIUS_K = 273.15;
