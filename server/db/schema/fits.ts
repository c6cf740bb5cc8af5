import { doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { FitShotResult } from '../../../shared/physics/types';
import type { FitInputSnapshot } from '../../../shared/fits/snapshot';
import type { FitState } from '../../../shared/schemas/fits';
import { shots } from './records';
import { teams } from './teams';
import { users } from './users';

// One stored fit of one track. The snapshot holds every input the fit used, so
// the numbers can be recomputed bit for bit long after marks or calibration moved on.
// clip, track and calibration are kept as plain ids (no foreign keys) on purpose:
// the snapshot is self-contained, and a reviewed fit must survive re-marking or
// the deletion of the track it came from.

export const fits = pgTable(
  'fits',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    shotId: uuid('shot_id')
      .notNull()
      .references(() => shots.id, { onDelete: 'cascade' }),
    clipId: uuid('clip_id').notNull(),
    trackId: uuid('track_id').notNull(),
    calibrationId: uuid('calibration_id').notNull(),
    calibrationVersion: integer('calibration_version').notNull(),
    /** Revision of the track's marks when the fit ran; compared on read for staleness. */
    marksRevision: integer('marks_revision').notNull(),
    state: text('state').$type<FitState>().notNull().default('awaiting-review'),
    inputSnapshot: jsonb('input_snapshot').$type<FitInputSnapshot>().notNull(),
    /** sha256 of the canonical JSON of the snapshot's physics input. */
    inputHash: text('input_hash').notNull(),
    result: jsonb('result').$type<FitShotResult>().notNull(),
    // Headline numbers, copied out of result so lists can sort and filter in SQL.
    launchSpeedMps: doublePrecision('launch_speed_mps').notNull(),
    launchAngleDeg: doublePrecision('launch_angle_deg').notNull(),
    dragCoefficient: doublePrecision('drag_coefficient'),
    dragK_perM: doublePrecision('drag_k_per_m'),
    rmsResidualM: doublePrecision('rms_residual_m').notNull(),
    dragVerdict: text('drag_verdict').notNull(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    reviewedBy: uuid('reviewed_by').references(() => users.id, { onDelete: 'set null' }),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    reviewNote: text('review_note'),
  },
  (t) => [
    index('fits_team_idx').on(t.teamId, t.createdAt),
    index('fits_shot_idx').on(t.shotId, t.createdAt),
    index('fits_track_idx').on(t.trackId),
  ],
);
