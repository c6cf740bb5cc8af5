import { doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { PresetHeterogeneity, PresetLauncherModel } from '../../../shared/schemas/presets';
import { fits } from './fits';
import { launchers, projectiles } from './records';
import { teams } from './teams';
import { users } from './users';

// Design presets: a launcher and projectile pair over a pressure range, with
// the team's current belief about its drag coefficient and launcher efficiency.
// Every change is a new immutable version, so a forecast or a fit comparison
// made against version 3 can be re-read exactly after version 4 is published.

export const designPresets = pgTable(
  'design_presets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    // restrict: a preset without its launcher or projectile cannot forecast anything.
    launcherId: uuid('launcher_id')
      .notNull()
      .references(() => launchers.id, { onDelete: 'restrict' }),
    projectileId: uuid('projectile_id')
      .notNull()
      .references(() => projectiles.id, { onDelete: 'restrict' }),
    pressureMinPa: doublePrecision('pressure_min_pa').notNull(),
    pressureMaxPa: doublePrecision('pressure_max_pa').notNull(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('design_presets_team_idx').on(t.teamId), unique('design_presets_team_name_uq').on(t.teamId, t.name)],
);

export const presetVersions = pgTable(
  'preset_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    presetId: uuid('preset_id')
      .notNull()
      .references(() => designPresets.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    dragCoefficient: doublePrecision('drag_coefficient').notNull(),
    dragCoefficientStd: doublePrecision('drag_coefficient_std').notNull(),
    /** Energy efficiency: the share of the launcher model's kinetic energy the projectile gets. */
    efficiency: doublePrecision('efficiency').notNull(),
    efficiencyStd: doublePrecision('efficiency_std').notNull(),
    launcherModel: text('launcher_model').$type<PresetLauncherModel>().notNull(),
    dragSource: text('drag_source').notNull(),
    efficiencySource: text('efficiency_source').notNull(),
    pooledFitIds: jsonb('pooled_fit_ids').$type<string[]>().notNull().default([]),
    /** Heterogeneity of the pooled Cd and efficiency; null for a handbook start. */
    heterogeneity: jsonb('heterogeneity').$type<PresetHeterogeneity | null>(),
    keepOutSafetyFactor: doublePrecision('keep_out_safety_factor').notNull(),
    note: text('note').notNull().default(''),
    publishedBy: uuid('published_by').references(() => users.id, { onDelete: 'set null' }),
    publishedAt: timestamp('published_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('preset_versions_preset_version_uq').on(t.presetId, t.version)],
);

/** Which preset version each fit was compared against (our own table, so the fits table stays its owner's). */
export const fitPresetComparisons = pgTable(
  'fit_preset_comparisons',
  {
    fitId: uuid('fit_id')
      .notNull()
      .references(() => fits.id, { onDelete: 'cascade' }),
    presetVersionId: uuid('preset_version_id')
      .notNull()
      .references(() => presetVersions.id, { onDelete: 'cascade' }),
    /** 'pooled' when the fit went into this version; 'compared' when it was checked against it. */
    role: text('role').$type<'pooled' | 'compared'>().notNull(),
    comparedAt: timestamp('compared_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.fitId, t.presetVersionId] }), index('fit_preset_comparisons_version_idx').on(t.presetVersionId)],
);
