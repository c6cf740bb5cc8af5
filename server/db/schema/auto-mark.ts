import { sql } from 'drizzle-orm';
import { doublePrecision, index, integer, jsonb, pgTable, real, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { AutoMarkEndReason, AutoMarkSeed, AutoMarkState } from '../../../shared/schemas/auto-mark';
import { teams } from './teams';
import { users } from './users';

// One row per request to mark a track automatically. The track and clip ids
// carry no foreign key on purpose: deleting the clip (and with it the track)
// must leave the run behind, so whoever started it can read that it ended
// cancelled.

export interface AutoMarkRequest {
  seed: AutoMarkSeed | null;
  fromFrame: number | null;
  toFrame: number | null;
  replace: boolean;
}

export const autoMarkRuns = pgTable(
  'auto_mark_runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    trackId: uuid('track_id').notNull(),
    clipId: uuid('clip_id').notNull(),
    state: text('state').$type<AutoMarkState>().notNull().default('queued'),
    progress: real('progress').notNull().default(0),
    framesMarked: integer('frames_marked').notNull().default(0),
    framesFlagged: integer('frames_flagged').notNull().default(0),
    launchFrame: integer('launch_frame'),
    endReason: text('end_reason').$type<AutoMarkEndReason>(),
    error: text('error'),
    request: jsonb('request').$type<AutoMarkRequest>().notNull(),
    /** Threshold the flags are counted against, copied from the team when the run starts. */
    reviewThreshold: doublePrecision('review_threshold').notNull(),
    /** The pg-boss job that owns the run. */
    jobId: uuid('job_id'),
    /** Bumped by each attempt that claims the run; an older attempt that wakes up writes nothing. */
    attempt: integer('attempt').notNull().default(0),
    /** Written while frames are being read; a stale one means the worker died. */
    heartbeatAt: timestamp('heartbeat_at', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('auto_mark_runs_track_idx').on(t.trackId, t.createdAt),
    index('auto_mark_runs_clip_idx').on(t.clipId),
    // At most one run at work per track: a second request is refused (409), even when two race.
    uniqueIndex('auto_mark_runs_one_active_per_track').on(t.trackId).where(sql`state in ('queued', 'running')`),
  ],
);
