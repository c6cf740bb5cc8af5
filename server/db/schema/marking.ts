import { boolean, doublePrecision, index, integer, jsonb, pgTable, primaryKey, real, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { PixelPoint } from '../../../shared/geometry/points';
import type { MarkSource } from '../../../shared/schemas/auto-mark';
import type { Downrange, TrackKind } from '../../../shared/schemas/marking';
import type { LensCorrection } from '../../../shared/schemas/camera';
import type { PlaneOffsetInput } from '../../../shared/geometry/plane-offset';
import { clips } from './clips';
import { teams } from './teams';
import { users } from './users';

// Calibration versions, tracks and marks of a clip. Pixel columns are in the
// served (already rotated) frame, u right / v down; metres and seconds are
// derived on read from the clip's current calibration and frame times, so a
// new calibration re-expresses every mark without rewriting it.

export interface StoredPlaneCorrection {
  corners: [PixelPoint, PixelPoint, PixelPoint, PixelPoint];
  widthM: number;
  heightM: number;
  /** Row-major, frame → rectified pixels (docs/marking-api.md). */
  homography: number[];
}

export const calibrations = pgTable(
  'calibrations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clipId: uuid('clip_id')
      .notNull()
      .references(() => clips.id, { onDelete: 'cascade' }),
    /** 1, 2, … per clip; never reused, the highest is current. */
    version: integer('version').notNull(),
    scaleP1UPx: doublePrecision('scale_p1_u_px').notNull(),
    scaleP1VPx: doublePrecision('scale_p1_v_px').notNull(),
    scaleP2UPx: doublePrecision('scale_p2_u_px').notNull(),
    scaleP2VPx: doublePrecision('scale_p2_v_px').notNull(),
    lengthM: doublePrecision('length_m').notNull(),
    lengthTolM: doublePrecision('length_tol_m').notNull(),
    endpointSigmaPx: doublePrecision('endpoint_sigma_px').notNull(),
    originUPx: doublePrecision('origin_u_px').notNull(),
    originVPx: doublePrecision('origin_v_px').notNull(),
    /** 'line': level_p1/p2 hold a world-level line; 'angle': level_angle_deg is the stated roll. */
    levelKind: text('level_kind').$type<'line' | 'angle'>().notNull(),
    levelP1UPx: doublePrecision('level_p1_u_px'),
    levelP1VPx: doublePrecision('level_p1_v_px'),
    levelP2UPx: doublePrecision('level_p2_u_px'),
    levelP2VPx: doublePrecision('level_p2_v_px'),
    levelAngleDeg: doublePrecision('level_angle_deg'),
    downrange: text('downrange').$type<Downrange>().notNull().default('right'),
    /** Roll actually used (from the line or as stated), degrees CCW on screen. */
    rollDeg: doublePrecision('roll_deg').notNull(),
    planeCorrection: jsonb('plane_correction').$type<StoredPlaneCorrection | null>(),
    /** Lens correction (model, coefficients, their uncertainties, fit residual, the clicked edges); null: an ideal lens. */
    lens: jsonb('lens').$type<LensCorrection | null>(),
    /** Camera-to-plane distance and the scale reference's offset from it, with tolerances; null: none stated. */
    planeOffset: jsonb('plane_offset').$type<PlaneOffsetInput | null>(),
    /** Click σ of the level line's end points (line) / ± tolerance of the stated roll (angle). */
    levelEndpointSigmaPx: doublePrecision('level_endpoint_sigma_px'),
    rollTolDeg: doublePrecision('roll_tol_deg'),
    /** Standard uncertainty of roll_deg, radians. */
    rollStdUncertaintyRad: doublePrecision('roll_std_uncertainty_rad').notNull().default(0),
    pixelsPerMetre: doublePrecision('pixels_per_metre').notNull(),
    scaleRelUncertainty: doublePrecision('scale_rel_uncertainty').notNull(),
    note: text('note'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique('calibrations_clip_version_uq').on(t.clipId, t.version)],
);

export const tracks = pgTable(
  'tracks',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    clipId: uuid('clip_id')
      .notNull()
      .references(() => clips.id, { onDelete: 'cascade' }),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    kind: text('kind').$type<TrackKind>().notNull().default('projectile'),
    /** Bumped by every mark write; each written mark takes the new value as its revision. */
    revision: integer('revision').notNull().default(0),
    /** Set when a frame marker hands the track to the engineers; cleared when they take it back. */
    markingDoneAt: timestamp('marking_done_at', { withTimezone: true }),
    markingDoneBy: uuid('marking_done_by').references(() => users.id, { onDelete: 'set null' }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('tracks_clip_idx').on(t.clipId, t.createdAt), index('tracks_team_idx').on(t.teamId)],
);

// No foreign key to clip_frames on purpose: frames are replaced as a whole on
// re-extraction, and that must never cascade into a person's marks.
export const marks = pgTable(
  'marks',
  {
    trackId: uuid('track_id')
      .notNull()
      .references(() => tracks.id, { onDelete: 'cascade' }),
    frameNumber: integer('frame_number').notNull(),
    uPx: doublePrecision('u_px').notNull(),
    vPx: doublePrecision('v_px').notNull(),
    placedUPx: doublePrecision('placed_u_px').notNull(),
    placedVPx: doublePrecision('placed_v_px').notNull(),
    snapped: boolean('snapped').notNull().default(false),
    /** Who placed it: 'hand', 'snap' (a person, snapped) or 'auto' (the automatic marker). */
    source: text('source').$type<MarkSource>().notNull().default('hand'),
    /** 0 … 1 for automatic marks; null for a person's. */
    confidence: real('confidence'),
    /** Short plain reason when an automatic mark's confidence is low. */
    lowConfidenceReason: text('low_confidence_reason'),
    /** The automatic run that wrote it (null for a person's marks). */
    autoMarkRunId: uuid('auto_mark_run_id'),
    revision: integer('revision').notNull(),
    updatedBy: uuid('updated_by').references(() => users.id, { onDelete: 'set null' }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.trackId, t.frameNumber] })],
);
