import { bigint, boolean, doublePrecision, index, integer, jsonb, pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { ClipStatus, ClipWarning, FrameFlag } from '../../../shared/schemas/clips';
import type { FrameStampPosition } from '../../../shared/physics/exposure-timing';
import { shots } from './records';
import { teams } from './teams';
import { users } from './users';

// A shot's video clips and their extracted frames. A clip row exists only for a
// file that passed validation; frames are replaced as a whole on each extraction.

export const clips = pgTable(
  'clips',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    shotId: uuid('shot_id')
      .notNull()
      .references(() => shots.id, { onDelete: 'cascade' }),
    originalName: text('original_name').notNull(),
    sha256: text('sha256').notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    storageKey: text('storage_key').notNull(),
    formatName: text('format_name').notNull(),
    codec: text('codec').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    rotationDeg: integer('rotation_deg').notNull().default(0),
    containerFps: doublePrecision('container_fps').notNull(),
    captureFps: doublePrecision('capture_fps').notNull(),
    /** Nominal tick of the file (r_frame_rate); 0 when unknown. */
    baseFps: doublePrecision('base_fps').notNull().default(0),
    frameCount: integer('frame_count').notNull(),
    /** Every frame's presentation timestamp (s), display order, read once at upload so jobs need no second ffprobe. */
    framePtsS: doublePrecision('frame_pts_s').array(),
    durationS: doublePrecision('duration_s').notNull(),
    variableFrameRate: boolean('variable_frame_rate').notNull().default(false),
    timeBaseWarnings: jsonb('time_base_warnings').$type<ClipWarning[]>().notNull().default([]),
    duplicateOfClipId: uuid('duplicate_of_clip_id'),
    /** Exposure (shutter) time of each frame, s; null when not stated. */
    shutterS: doublePrecision('shutter_s'),
    /** Where in the exposure the camera stamps each frame (shared/physics/exposure-timing.ts). */
    frameStamp: text('frame_stamp').$type<FrameStampPosition>().notNull().default('middle'),
    inFrame: integer('in_frame').notNull(),
    outFrame: integer('out_frame').notNull(),
    status: text('status').$type<ClipStatus>().notNull().default('queued'),
    progress: real('progress').notNull().default(0),
    error: text('error'),
    /** Set while a job waits for something outside the database to come back ('storage': the object store). */
    waitingFor: text('waiting_for').$type<'storage'>(),
    extractedCount: integer('extracted_count').notNull().default(0),
    thumbnailCount: integer('thumbnail_count').notNull().default(0),
    /** The extraction job that owns the clip now; a superseded job's run must not touch the frames. */
    jobId: uuid('job_id'),
    /** Written by a running extraction; a stale one means its worker died. */
    heartbeatAt: timestamp('heartbeat_at', { withTimezone: true }),
    /** Storage prefix of the current frame set (versioned, so a new set replaces the old atomically). */
    framesPrefix: text('frames_prefix'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('clips_shot_idx').on(t.shotId, t.createdAt), index('clips_team_sha_idx').on(t.teamId, t.sha256)],
);

export const clipFrames = pgTable(
  'clip_frames',
  {
    clipId: uuid('clip_id')
      .notNull()
      .references(() => clips.id, { onDelete: 'cascade' }),
    /** Source frame number, 0-based, in presentation order. */
    frameNumber: integer('frame_number').notNull(),
    /** Seconds since frame 0 in capture time. */
    tS: doublePrecision('t_s').notNull(),
    ptsS: doublePrecision('pts_s'),
    flag: text('flag').$type<FrameFlag>(),
    storageKey: text('storage_key').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
  },
  (t) => [primaryKey({ columns: [t.clipId, t.frameNumber] })],
);
