import { date, doublePrecision, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
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
    notes: text('notes'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('shots_team_idx').on(t.teamId, t.createdAt), index('shots_series_idx').on(t.seriesId)],
);
