import { z } from 'zod';
import { CLICK_SIGMA_PX, SNAP_WINDOW_PX } from '../defaults';
import { PixelPoint, pixelCoord } from '../geometry/points';
import { LensCorrection, LensInput, LevelUncertaintyInput, PlaneOffsetInput } from './camera';
import { MarkSource } from './auto-mark';
import { Uuid, WholeNumber } from './common';

// Contract of the calibrate-and-mark API (docs/marking-api.md explains the
// routes). Pixel coordinates: u to the right, v down, origin at the top-left
// corner of the frame, in frame pixels (sub-pixel values allowed). World
// coordinates: metres, x to the right/downrange, y up.

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);

export const ClipParams = z.object({ teamId: Uuid, clipId: Uuid });
export const TrackParams = z.object({ teamId: Uuid, trackId: Uuid });
export const FrameNumber = z.coerce.number().int('must be a whole frame number').min(0, 'must be 0 or more').max(10_000_000);
export const MarkParams = z.object({ teamId: Uuid, trackId: Uuid, frameNumber: FrameNumber });
export const ClipFrameParams = z.object({ teamId: Uuid, clipId: Uuid, frameNumber: FrameNumber });

// ---------------------------------------------------------------- calibration

/** Scale reference: two end points of an object of known length, with how well that length and the clicks are known. */
export const ScaleReference = z.object({
  p1: PixelPoint,
  p2: PixelPoint,
  // Physical range: a reference bar or marked distance of up to a kilometre.
  lengthM: finite('lengthM').refine((v) => v > 0 && v <= 1000, 'lengthM must be more than 0 and at most 1000 m'),
  /** Stated tolerance ±a of the length, treated as a uniform distribution (GUM §4.3.7). */
  lengthTolM: finite('lengthTolM').refine((v) => v >= 0 && v <= 100, 'lengthTolM must be between 0 and 100 m').default(0),
  /** Standard uncertainty of placing each end point, pixels. */
  endpointSigmaPx: finite('endpointSigmaPx').refine((v) => v >= 0 && v <= 50, 'endpointSigmaPx must be between 0 and 50').default(CLICK_SIGMA_PX),
});
export type ScaleReference = z.infer<typeof ScaleReference>;

/**
 * Camera roll: either a line on the frame that is level in the world (its
 * two points, any order), or the stated angle a world-horizontal line makes
 * on screen, degrees, counter-clockwise positive (as seen on screen).
 */
export const LevelInput = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('line'), p1: PixelPoint, p2: PixelPoint }),
  z.object({ kind: z.literal('angle'), rollDeg: finite('rollDeg').refine((v) => Math.abs(v) <= 45, 'rollDeg must be within ±45°') }),
]);
export type LevelInput = z.infer<typeof LevelInput>;

/**
 * Plane correction: the four corners of a rectangle of known size that lies in
 * the flight plane, as seen on the frame, in the order top-left, top-right,
 * bottom-right, bottom-left (as the rectangle stands in the world).
 */
export const PlaneCorrectionInput = z.object({
  corners: z.tuple([PixelPoint, PixelPoint, PixelPoint, PixelPoint]),
  widthM: finite('widthM').refine((v) => v > 0 && v <= 1000, 'widthM must be more than 0 and at most 1000 m'),
  heightM: finite('heightM').refine((v) => v > 0 && v <= 1000, 'heightM must be more than 0 and at most 1000 m'),
});
export type PlaneCorrectionInput = z.infer<typeof PlaneCorrectionInput>;

/** Which way the shot flies on screen; x (downrange) points that way. */
export const Downrange = z.enum(['right', 'left']);
export type Downrange = z.infer<typeof Downrange>;

export const CalibrationCreateBody = z
  .object({
    scale: ScaleReference,
    origin: PixelPoint,
    level: LevelInput,
    downrange: Downrange.default('right'),
    plane: PlaneCorrectionInput.nullable().default(null),
    /** Lens correction: straight edges to fit, or known coefficients (shared/schemas/camera.ts). */
    lens: LensInput.nullable().default(null),
    /** Camera-to-plane distance and the scale reference's offset from the plane; null: the reference lies in the plane. */
    planeOffset: PlaneOffsetInput.nullable().default(null),
    /** Click σ of the level line's end points, or the ± tolerance of a stated roll. */
    levelUncertainty: LevelUncertaintyInput.nullable().default(null),
    note: z.string().trim().max(500).optional(),
  })
  .superRefine((body, ctx) => {
    const { p1, p2, lengthM, lengthTolM } = body.scale;
    if (Math.hypot(p2.u - p1.u, p2.v - p1.v) < 1) {
      ctx.addIssue({ code: 'custom', path: ['scale', 'p2'], message: 'scale end points must be at least 1 px apart' });
    }
    if (lengthTolM >= lengthM) {
      ctx.addIssue({ code: 'custom', path: ['scale', 'lengthTolM'], message: 'length tolerance must be smaller than the length' });
    }
    if (body.level.kind === 'line') {
      const { p1: a, p2: b } = body.level;
      if (Math.hypot(b.u - a.u, b.v - a.v) < 1) {
        ctx.addIssue({ code: 'custom', path: ['level', 'p2'], message: 'level line points must be at least 1 px apart' });
      }
    }
    // Degenerate homographies (three corners in a line, crossed order) are checked on the server by the solver.
  });
export type CalibrationCreateBody = z.input<typeof CalibrationCreateBody>;

export const PersonRef = z.object({ id: Uuid, displayName: z.string() });
export type PersonRef = z.infer<typeof PersonRef>;

export const Calibration = z.object({
  id: Uuid,
  clipId: Uuid,
  /** 1, 2, … per clip; the highest is current. */
  version: z.number().int(),
  scale: ScaleReference,
  origin: PixelPoint,
  level: LevelInput,
  downrange: Downrange,
  /** Homography is row-major 3×3 mapping frame pixels to rectified pixels (see docs). */
  plane: z
    .object({
      corners: z.tuple([PixelPoint, PixelPoint, PixelPoint, PixelPoint]),
      widthM: z.number(),
      heightM: z.number(),
      homography: z.array(z.number()).length(9),
    })
    .nullable(),
  /** Camera roll actually used, degrees CCW on screen (from the line or as stated). */
  rollDeg: z.number(),
  /** Its standard uncertainty, degrees (level-line clicks through the corrections, or the stated tolerance). */
  rollStdUncertaintyDeg: z.number(),
  /**
   * The level uncertainty as stated and stored, defaults filled in: a level line's click σ (px)
   * or a stated roll's ± tolerance (°), whichever the level is. Null on versions saved before it was stored.
   */
  levelUncertainty: LevelUncertaintyInput.nullable(),
  /** The lens correction in use, with its coefficients' uncertainties and the straightness residual; null: an ideal lens. */
  lens: LensCorrection.nullable(),
  /** The scale reference's offset from the flight plane; factor = (D − δ)/D multiplies the reference's pixels per metre. Null: none stated. */
  planeOffset: z
    .object({
      planeDistanceM: z.number(),
      planeDistanceTolM: z.number(),
      referenceOffsetM: z.number(),
      referenceOffsetTolM: z.number(),
      factor: z.number(),
      relStdUncertainty: z.number(),
    })
    .nullable(),
  pixelsPerMetre: z.number(),
  /** Relative standard uncertainty of pixelsPerMetre (dimensionless, e.g. 0.004 = 0.4 %). */
  scaleRelUncertainty: z.number(),
  note: z.string().nullable(),
  createdBy: PersonRef.nullable(),
  createdAt: z.string(),
});
export type Calibration = z.infer<typeof Calibration>;

export const CalibrationList = z.object({ calibrations: z.array(Calibration) });
export type CalibrationList = z.infer<typeof CalibrationList>;
export const CurrentCalibration = z.object({ calibration: Calibration.nullable() });
export type CurrentCalibration = z.infer<typeof CurrentCalibration>;

// --------------------------------------------------------------------- tracks

export const TRACK_KINDS = ['projectile', 'muzzle'] as const;
export const TrackKind = z.enum(TRACK_KINDS);
export type TrackKind = z.infer<typeof TrackKind>;

export const TrackName = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');

export const TrackCreateBody = z.object({ name: TrackName, kind: TrackKind.default('projectile') });
export type TrackCreateBody = z.input<typeof TrackCreateBody>;

export const TrackUpdateBody = z
  .object({ name: TrackName, kind: TrackKind })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type TrackUpdateBody = z.infer<typeof TrackUpdateBody>;

export const Track = z.object({
  id: Uuid,
  clipId: Uuid,
  teamId: Uuid,
  name: z.string(),
  kind: TrackKind,
  /** Bumped by every mark write on the track; mark revisions are drawn from it. */
  revision: z.number().int(),
  markCount: z.number().int(),
  /** Set when a frame marker handed the track to the engineers (hand-offs); null while marking goes on. */
  markingDone: z.object({ at: z.string(), by: PersonRef.nullable() }).nullable(),
  createdAt: z.string(),
});
export type Track = z.infer<typeof Track>;
/** done = true hands the track to the engineers; false takes it back for more marking. */
export const MarkingDoneBody = z.object({ done: z.boolean() });
export type MarkingDoneBody = z.infer<typeof MarkingDoneBody>;
export const TrackList = z.object({ tracks: z.array(Track) });
export type TrackList = z.infer<typeof TrackList>;

// ---------------------------------------------------------------------- marks

export const Mark = z.object({
  frameNumber: z.number().int(),
  /** Where the mark is (after snapping, if snapped). */
  uPx: z.number(),
  vPx: z.number(),
  /** Where the person clicked or dragged to, before any snap. */
  placedUPx: z.number(),
  placedVPx: z.number(),
  snapped: z.boolean(),
  /** Who placed it (shared/schemas/auto-mark.ts): a person by hand, a person with the snap, or the automatic marker. */
  source: MarkSource,
  /** 0 … 1 for automatic marks; null for a person's. */
  confidence: z.number().nullable(),
  /** Why an automatic mark's confidence is low (e.g. 'weak contrast'); else null. */
  lowConfidenceReason: z.string().nullable(),
  /** Version token of this mark; send it back as expectedRevision. Unique within the track, never reused. */
  revision: z.number().int(),
  updatedBy: PersonRef.nullable(),
  updatedAt: z.string(),
  /** Time of the frame from the clip's frame table (or frame / capture fps); null when unknown. */
  tS: z.number().nullable(),
  /** World position from the clip's current calibration; null when the clip is not calibrated. */
  xM: z.number().nullable(),
  yM: z.number().nullable(),
});
export type Mark = z.infer<typeof Mark>;

export const MarksResponse = z.object({
  trackId: Uuid,
  trackRevision: z.number().int(),
  /** The calibration xM/yM were computed with (null: uncalibrated). */
  calibrationId: Uuid.nullable(),
  calibrationVersion: z.number().int().nullable(),
  marks: z.array(Mark),
});
export type MarksResponse = z.infer<typeof MarksResponse>;

/**
 * expectedRevision: the revision of the mark the writer last saw.
 *  - a number: update only if the stored mark still has that revision, else 409
 *    (also 409 with current: null if the mark was deleted meanwhile);
 *  - null or absent: create only; if a mark already exists on that frame, 409.
 * A 409 body carries `current` (the stored Mark or null) and `trackRevision`.
 */
export const MarkUpsertBody = z
  .object({
    uPx: pixelCoord('uPx'),
    vPx: pixelCoord('vPx'),
    placedUPx: pixelCoord('placedUPx').optional(),
    placedVPx: pixelCoord('placedVPx').optional(),
    snapped: z.boolean().default(false),
    expectedRevision: WholeNumber.nullable().optional(),
  })
  .refine((b) => (b.placedUPx === undefined) === (b.placedVPx === undefined), {
    message: 'send both placedUPx and placedVPx, or neither',
    path: ['placedVPx'],
  });
export type MarkUpsertBody = z.input<typeof MarkUpsertBody>;

export const MarkWriteResult = z.object({ mark: Mark, trackRevision: z.number().int(), created: z.boolean() });
export type MarkWriteResult = z.infer<typeof MarkWriteResult>;

export const MarkDeleteQuery = z.object({ expectedRevision: z.coerce.number().pipe(WholeNumber) });
export const MarkDeleteResult = z.object({ trackRevision: z.number().int() });
export type MarkDeleteResult = z.infer<typeof MarkDeleteResult>;

/** 409 problem+json body of a stale mark write or delete. */
export const MarkConflictProblem = z.object({
  type: z.string(),
  title: z.string(),
  status: z.literal(409),
  detail: z.string(),
  current: Mark.nullable(),
  trackRevision: z.number().int(),
});
export type MarkConflictProblem = z.infer<typeof MarkConflictProblem>;

// ------------------------------------------------------------------ CSV files

export const MARKS_CSV_KINDS = ['pixel', 'world'] as const;
export const MarksCsvKind = z.enum(MARKS_CSV_KINDS);
export type MarksCsvKind = z.infer<typeof MarksCsvKind>;

/** Headers (first line, required): pixel `frame,u_px,v_px`; world `t_s,x_m,y_m`. */
export const MARKS_CSV_HEADERS: Record<MarksCsvKind, readonly [string, string, string]> = {
  pixel: ['frame', 'u_px', 'v_px'],
  world: ['t_s', 'x_m', 'y_m'],
};

export const MarksImportBody = z.object({
  csv: z.string().min(1, 'is empty').max(2_000_000, 'is larger than 2 MB'),
  kind: MarksCsvKind,
  /** true: the track's marks are replaced by the file; false: file rows overwrite marks on the same frames, others stay. */
  replace: z.boolean().default(false),
});
export type MarksImportBody = z.input<typeof MarksImportBody>;

export const MarksImportResult = z.object({ imported: z.number().int(), trackRevision: z.number().int() });
export type MarksImportResult = z.infer<typeof MarksImportResult>;

/** A CSV problem (400) lists each bad line: `lineErrors: [{ line, message }]` (line 1 is the header). */
export const CsvLineError = z.object({ line: z.number().int(), message: z.string() });
export type CsvLineError = z.infer<typeof CsvLineError>;

export const MarksExportQuery = z.object({ kind: MarksCsvKind.default('pixel') });

// ----------------------------------------------------------------------- snap

export const SnapBody = z.object({
  uPx: pixelCoord('uPx'),
  vPx: pixelCoord('vPx'),
  windowPx: z.number().int().min(5).max(101).default(SNAP_WINDOW_PX),
  /** true: a dark projectile on a lighter background (the usual case). */
  dark: z.boolean().default(true),
});
export type SnapBody = z.input<typeof SnapBody>;

export const SnapResult = z.object({
  /** null when nothing stands out from the background inside the window. */
  snapped: z.object({ uPx: z.number(), vPx: z.number(), confidence: z.number() }).nullable(),
});
export type SnapResult = z.infer<typeof SnapResult>;
