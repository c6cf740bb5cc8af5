// What Arcbench assumes when a person states nothing. One module, so the API,
// the fit command, the editor and the seed all assume the same, and a reviewer
// finds every assumption (and its source) in one place.

/** Air density when a shot has no conditions: US Standard Atmosphere 1976 at sea level, kg/m³. */
export const UNKNOWN_AIR_DENSITY_KG_M3 = 1.225;
/**
 * Relative standard uncertainty of assuming it: ordinary weather and modest
 * site altitude move density by several per cent (from memory: about ±5 %
 * between a hot and a cold day at sea level), so 3 % (one sigma).
 */
export const UNKNOWN_AIR_DENSITY_REL_SIGMA = 0.03;

/**
 * Relative ± tolerance of an air density stated directly without one: ±1 %
 * (rectangular, so u ≈ 0.58 %). Common practice for a density read off a site
 * weather station or worked out by hand from its readings; a field meter's own
 * readings (WEATHER_READING_SIGMAS below) give about 0.2 %.
 */
export const STATED_AIR_DENSITY_REL_TOL = 0.01;

/** Relative humidity assumed when none was recorded, %. */
export const UNKNOWN_RELATIVE_HUMIDITY_PCT = 50;
/** Its standard uncertainty: uniform over 0..100 %, 100/√12 ≈ 28.9 (GUM §4.3.7), rounded up to 29. */
export const UNKNOWN_RELATIVE_HUMIDITY_SIGMA_PCT = 29;

/**
 * Standard uncertainties of field weather readings. Common practice for a
 * hand-held weather meter at the firing point, not a calibrated station:
 * ±0.5 K, ±50 Pa, ±5 %RH (one sigma).
 */
export const WEATHER_READING_SIGMAS = { temperatureK: 0.5, pressurePa: 50, relativeHumidityPct: 5 } as const;

/** Standard uncertainty of one click on a frame (a scale end point, a mark), pixels: half a pixel, common practice. */
export const CLICK_SIGMA_PX = 0.5;

/** Side of the square the sub-pixel snap searches around a click, pixels. */
export const SNAP_WINDOW_PX = 21;

/**
 * Standard uncertainties of a projectile record that states none. Common
 * practice: a 0.1 g balance reading and a vernier calliper (0.05 mm), each
 * taken as the standard uncertainty.
 */
export const PROJECTILE_MASS_SIGMA_KG = 1e-4;
export const PROJECTILE_DIAMETER_SIGMA_M = 5e-5;
