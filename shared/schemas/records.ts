import { z } from 'zod';
import type { ClipStatus } from './clips';
import { WindInput } from './camera';
import { Uuid } from './common';
import type { LauncherResponse, ProjectileResponse, SeriesResponse } from './record-responses';
import { limitText } from '../fits/format';

// Test records: series, launchers, projectiles, shots. Every quantity is SI in
// the API (Pa, m, kg, m³) except air temperature (°C, as thermometers read) and
// humidity (%). The client may show kPa, but it converts before sending.

const Name = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
const OptionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `must be at most ${max} characters`)
    .nullish()
    .transform((v) => (v ? v : null));
const Notes = OptionalText(4000);

/** A finite number inside [min, max], with the bounds in the message so a form can say why. */
function bounded(min: number, max: number, unit: string) {
  return z
    .number({ error: 'must be a number' })
    .refine(Number.isFinite, 'must be a finite number')
    .refine((v) => v >= min && v <= max, `must be between ${limitText(min, unit)} and ${limitText(max, unit)}`);
}
/** A strictly positive number up to max. */
function positive(max: number, unit: string) {
  return z
    .number({ error: 'must be a number' })
    .refine(Number.isFinite, 'must be a finite number')
    .refine((v) => v > 0 && v <= max, `must be more than 0 and at most ${limitText(max, unit)}`);
}
const nullable = <T extends z.ZodType>(schema: T) => schema.nullish().transform((v) => v ?? null);

/** Calendar date as YYYY-MM-DD (ISO 8601), stored without a time zone. */
export const IsoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date as YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'is not a real calendar date');

// Bounds. Where they come from is said beside each; they reject typos, not physics.
export const BOUNDS = {
  /** 0..50 MPa: above any compressed-gas launcher we expect (common practice for HPA cylinders is ≤ 30 MPa). */
  chamberPressurePa: [0, 5e7],
  /** −10..90°: a little below level for downhill setups, up to vertical. */
  elevationDeg: [-10, 90],
  /** −60..60 °C: any plausible test day (record extremes, from memory: −89 °C Vostok, 57 °C Death Valley; nobody fires a launcher there). */
  airTempC: [-60, 60],
  /** 50..110 kPa: station pressure from ~5.5 km altitude up to a strong high at sea level (US Standard Atmosphere 1976: 54 kPa at 5 km). */
  stationPressurePa: [5e4, 1.1e5],
  relativeHumidityPct: [0, 100],
  /** Up to 5 km of tape-measured range. */
  tapeRangeM: [0, 5000],
  /** −10..100 m: a launch point a little below the ground it is measured from (a pit) up to a tall tower. */
  launchHeightM: [-10, 100],
  /**
   * 0.45..1.85 kg/m³: the density the temperature and pressure bounds above allow, humid air at
   * 60 °C and 50 kPa (≈ 0.50) up to dry air at −60 °C and 110 kPa (≈ 1.80), by the ideal-gas law ρ = p/(R T)
   * with R = 287.05 J/(kg K) (ISO 2533 / US Standard Atmosphere 1976), with a margin.
   */
  airDensityKgM3: [0.45, 1.85],
} as const;

// ── Series ──────────────────────────────────────────────────────────────────
export const SeriesParams = z.object({ teamId: Uuid, seriesId: Uuid });

export const SeriesCreateBody = z.object({
  name: Name,
  testDate: IsoDate,
  site: OptionalText(120),
  notes: Notes,
});
export type SeriesCreateBody = z.input<typeof SeriesCreateBody>;

export const SeriesUpdateBody = SeriesCreateBody.partial().refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type SeriesUpdateBody = z.input<typeof SeriesUpdateBody>;

export const SeriesListQuery = z.object({
  q: z.string().trim().max(120).optional(),
  sort: z.enum(['date', 'name', 'created']).default('date'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});

export type Series = z.infer<typeof SeriesResponse>;

// ── Launchers ───────────────────────────────────────────────────────────────
export const LauncherParams = z.object({ teamId: Uuid, launcherId: Uuid });

export const LauncherCreateBody = z.object({
  name: Name,
  kind: OptionalText(120),
  boreM: nullable(positive(1, 'm')),
  barrelLengthM: nullable(positive(20, 'm')),
  chamberVolumeM3: nullable(positive(1, 'm³')),
  maxWorkingPressurePa: nullable(positive(BOUNDS.chamberPressurePa[1], 'Pa')),
  valveType: OptionalText(120),
  notes: Notes,
});
export type LauncherCreateBody = z.input<typeof LauncherCreateBody>;
export const LauncherUpdateBody = LauncherCreateBody.partial().refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');

export type Launcher = z.infer<typeof LauncherResponse>;

// ── Projectiles ─────────────────────────────────────────────────────────────
export const ProjectileParams = z.object({ teamId: Uuid, projectileId: Uuid });

export const ProjectileCreateBody = z.object({
  name: Name,
  massKg: positive(100, 'kg'),
  diameterM: positive(1, 'm'),
  shape: OptionalText(120),
  referenceAreaM2: nullable(positive(1, 'm²')),
  notes: Notes,
});
export type ProjectileCreateBody = z.input<typeof ProjectileCreateBody>;
export const ProjectileUpdateBody = ProjectileCreateBody.partial().refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');

export type Projectile = z.infer<typeof ProjectileResponse>;

// ── Shots ───────────────────────────────────────────────────────────────────
export const ShotParams = z.object({ teamId: Uuid, shotId: Uuid });

/**
 * Air density stated directly (a weather station's or a density meter's reading), used instead of
 * temperature, pressure and humidity; tolKgM3 is a ± limit taken as rectangular (GUM §4.3.7).
 */
export const StatedAirDensity = z.object({
  densityKgM3: bounded(...BOUNDS.airDensityKgM3, 'kg/m³'),
  tolKgM3: bounded(0, 0.5, 'kg/m³').nullish().transform((v) => v ?? null),
});
export type StatedAirDensity = z.infer<typeof StatedAirDensity>;

const shotFields = {
  seriesId: Uuid,
  launcherId: Uuid.nullish().transform((v) => v ?? null),
  projectileId: Uuid.nullish().transform((v) => v ?? null),
  label: Name,
  chamberPressurePa: nullable(bounded(...BOUNDS.chamberPressurePa, 'Pa')),
  elevationDeg: nullable(bounded(...BOUNDS.elevationDeg, '°')),
  airTempC: nullable(bounded(...BOUNDS.airTempC, '°C')),
  stationPressurePa: nullable(bounded(...BOUNDS.stationPressurePa, 'Pa')),
  relativeHumidityPct: nullable(bounded(...BOUNDS.relativeHumidityPct, '%')),
  tapeRangeM: nullable(bounded(...BOUNDS.tapeRangeM, 'm')),
  /** Wind at the firing point relative to the line of fire; the fit uses its along-plane part (shared/physics/wind.ts). */
  wind: nullable(WindInput),
  launchHeightM: nullable(bounded(...BOUNDS.launchHeightM, 'm')),
  /** Null: the density comes from airTempC, stationPressurePa and relativeHumidityPct (or the standard atmosphere). */
  airDensity: nullable(StatedAirDensity),
  notes: Notes,
};

export const ShotCreateBody = z.object(shotFields);
export type ShotCreateBody = z.input<typeof ShotCreateBody>;
export const ShotUpdateBody = z
  .object(shotFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type ShotUpdateBody = z.input<typeof ShotUpdateBody>;

export const SHOT_SORTS = ['label', 'created', 'series', 'launcher', 'elevation', 'pressure'] as const;
export type ShotSort = (typeof SHOT_SORTS)[number];

export const ShotListQuery = z.object({
  page: z.coerce.number().int().min(1, 'must be 1 or more').default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'must be at most 100').default(25),
  sort: z.enum(SHOT_SORTS).default('created'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  seriesId: Uuid.optional(),
  launcherId: Uuid.optional(),
  projectileId: Uuid.optional(),
  q: z.string().trim().max(120).optional(),
});
export type ShotListQuery = z.input<typeof ShotListQuery>;

export interface Shot {
  id: string;
  seriesId: string;
  seriesName: string;
  launcherId: string | null;
  launcherName: string | null;
  projectileId: string | null;
  projectileName: string | null;
  label: string;
  chamberPressurePa: number | null;
  elevationDeg: number | null;
  airTempC: number | null;
  stationPressurePa: number | null;
  relativeHumidityPct: number | null;
  tapeRangeM: number | null;
  wind: WindInput | null;
  launchHeightM: number | null;
  airDensity: StatedAirDensity | null;
  notes: string | null;
  createdAt: string;
  updatedAt: string;
  /** The newest clip of the shot, or null when none was uploaded yet. */
  latestClip: { id: string; status: ClipStatus; progress: number } | null;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}
