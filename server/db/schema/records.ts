import { date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { LensCoefficients } from '../../../shared/schemas/camera';
import { teams } from './teams';
import { users } from './users';

// A team's test records: the day's series, its launchers and projectiles, and
// each shot with the conditions it was fired in. SI units in column names.

export const testSeries = pgTable(
  'test_series',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    testDate: date('test_date').notNull(),
    site: text('site'),
    notes: text('notes'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('test_series_team_idx').on(t.teamId, t.testDate)],
);

export const launchers = pgTable(
  'launchers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    kind: text('kind'),
    boreM: doublePrecision('bore_m'),
    barrelLengthM: doublePrecision('barrel_length_m'),
    chamberVolumeM3: doublePrecision('chamber_volume_m3'),
    maxWorkingPressurePa: doublePrecision('max_working_pressure_pa'),
    valveType: text('valve_type'),
    notes: text('notes'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('launchers_team_idx').on(t.teamId)],
);

export const projectiles = pgTable(
  'projectiles',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    massKg: doublePrecision('mass_kg').notNull(),
    diameterM: doublePrecision('diameter_m').notNull(),
    shape: text('shape'),
    /** Frontal area used for Cd; defaults to π d²/4 when null. */
    referenceAreaM2: doublePrecision('reference_area_m2'),
    notes: text('notes'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('projectiles_team_idx').on(t.teamId)],
);

export const shots = pgTable(
  'shots',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    seriesId: uuid('series_id')
      .notNull()
      .references(() => testSeries.id, { onDelete: 'cascade' }),
    launcherId: uuid('launcher_id').references(() => launchers.id, { onDelete: 'set null' }),
    projectileId: uuid('projectile_id').references(() => projectiles.id, { onDelete: 'set null' }),
    label: text('label').notNull(),
    chamberPressurePa: doublePrecision('chamber_pressure_pa'),
    elevationDeg: doublePrecision('elevation_deg'),
    airTempC: doublePrecision('air_temp_c'),
    stationPressurePa: doublePrecision('station_pressure_pa'),
    relativeHumidityPct: doublePrecision('relative_humidity_pct'),
    tapeRangeM: doublePrecision('tape_range_m'),
    /** Wind at the firing point: speed, and the direction it blows from, clockwise from the line of fire (shared/physics/wind.ts). */
    windSpeedMps: doublePrecision('wind_speed_mps'),
    windFromDeg: doublePrecision('wind_from_deg'),
    /** Height of the launch point above the ground, m. */
    launchHeightM: doublePrecision('launch_height_m'),
    /** Air density stated directly (used instead of temperature, pressure and humidity), with its ± tolerance. */
    airDensityKgM3: doublePrecision('air_density_kg_m3'),
    airDensityTolKgM3: doublePrecision('air_density_tol_kg_m3'),
    notes: text('notes'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('shots_team_idx').on(t.teamId, t.createdAt), index('shots_series_idx').on(t.seriesId)],
);

/**
 * A lens the team measured once: Brown–Conrady k1, k2 on the radius normalised
 * by the half-diagonal of the frame size it was measured at. A calibration that
 * uses a profile copies the coefficients, so editing a profile changes no version.
 */
export const lensProfiles = pgTable(
  'lens_profiles',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    cameraNote: text('camera_note'),
    coefficients: jsonb('coefficients').$type<LensCoefficients>().notNull(),
    frameWidthPx: integer('frame_width_px').notNull(),
    frameHeightPx: integer('frame_height_px').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('lens_profiles_team_idx').on(t.teamId)],
);
