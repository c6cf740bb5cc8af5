import { z } from 'zod';
import { PixelPoint } from '../geometry/points';
import { Uuid } from './common';
import { FRAME_STAMP_POSITIONS } from '../physics/exposure-timing';

// What a real camera adds to a calibration, a clip and a shot (issue #12):
// lens correction, the scale reference's offset from the flight plane, the
// level's uncertainty, the exposure timing, and wind. Units are in the names;
// every "Tol" is a ± limit taken as a rectangular distribution (GUM §4.3.7).
// The geometric checks that need numbers together (lines that determine
// nothing, an offset larger than the distance, folding coefficients) run in
// shared/geometry and come back as 400 problem+json with the field named.

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);

/**
 * Radial lens coefficients, Brown–Conrady k1 and k2 about the frame centre, on
 * the radius normalised by the frame's half-diagonal (shared/geometry/lens-distortion.ts):
 * a point at ideal radius r shows at r (1 + k1 r² + k2 r⁴). Stated coefficients
 * may carry their standard uncertainties and correlation.
 */
export const LensCoefficients = z.object({
  k1: finite('k1').refine((v) => Math.abs(v) <= 2, 'k1 must be between −2 and 2'),
  k2: finite('k2').refine((v) => Math.abs(v) <= 2, 'k2 must be between −2 and 2').default(0),
  k1StdUnc: finite('k1StdUnc').refine((v) => v >= 0 && v <= 1, 'k1StdUnc must be between 0 and 1').default(0),
  k2StdUnc: finite('k2StdUnc').refine((v) => v >= 0 && v <= 1, 'k2StdUnc must be between 0 and 1').default(0),
  /** Correlation of k1 and k2 (−1…1). */
  k1k2Correlation: finite('k1k2Correlation').refine((v) => Math.abs(v) <= 1, 'k1k2Correlation must be between −1 and 1').default(0),
});
export type LensCoefficients = z.infer<typeof LensCoefficients>;

/** A straight edge in the scene: at least 3 clicked points along it (checked with a plain message by the fit). */
export const StraightLine = z.array(PixelPoint).max(200, 'at most 200 points per straight edge');

/**
 * Lens correction, one of three: straight edges clicked in the frame (the server
 * fits the coefficients), known coefficients, or a team lens profile by id (the
 * server copies its coefficients into the calibration, so a later edit of the
 * profile changes no calibration version).
 */
export const LensInput = z
  .object({
    straightLines: z.array(StraightLine).max(40, 'at most 40 straight edges').optional(),
    coefficients: LensCoefficients.optional(),
    profileId: Uuid.optional(),
    /** Standard uncertainty of each straight-edge click, px; floors the fitted coefficients' uncertainty. */
    clickSigmaPx: finite('clickSigmaPx').refine((v) => v >= 0 && v <= 20, 'clickSigmaPx must be between 0 and 20').optional(),
  })
  .refine((v) => [v.straightLines, v.coefficients, v.profileId].filter((x) => x !== undefined).length === 1, {
    message: 'give exactly one of straightLines (to fit), coefficients (known) or profileId (a team lens profile)',
  });
export type LensInput = z.input<typeof LensInput>;

/** The lens correction as stored and returned: the model, its coefficients and how well they are known. */
export const LensCorrection = z.object({
  model: z.literal('brown-conrady-radial'),
  source: z.enum(['straight-lines', 'coefficients', 'profile']),
  /** The team lens profile the coefficients were copied from (source 'profile'); absent or null otherwise. */
  profile: z.object({ id: Uuid, name: z.string() }).nullable().optional(),
  k1: z.number(),
  k2: z.number(),
  k1StdUnc: z.number(),
  k2StdUnc: z.number(),
  k1k2Correlation: z.number(),
  /** Fit from straight edges: RMS distance of the clicks from their straightened lines, px; null for stated coefficients. */
  residualRmsPx: z.number().nullable(),
  /** How many coefficients were fitted (1: k1 only). Null for stated ones. */
  terms: z.number().int().nullable(),
  straightLines: z.array(z.array(PixelPoint)).nullable(),
  notes: z.array(z.string()),
  /** Frame size the normalised radius refers to. */
  frameWidthPx: z.number(),
  frameHeightPx: z.number(),
});
export type LensCorrection = z.infer<typeof LensCorrection>;

/** Camera distance to the flight plane and the scale reference's offset from it (positive towards the camera). */
export const PlaneOffsetInput = z.object({
  planeDistanceM: finite('planeDistanceM').refine((v) => v > 0 && v <= 10_000, 'planeDistanceM must be positive'),
  planeDistanceTolM: finite('planeDistanceTolM').refine((v) => v >= 0, 'planeDistanceTolM must be 0 or more').default(0),
  referenceOffsetM: finite('referenceOffsetM'),
  referenceOffsetTolM: finite('referenceOffsetTolM').refine((v) => v >= 0, 'referenceOffsetTolM must be 0 or more').default(0),
});
export type PlaneOffsetInput = z.input<typeof PlaneOffsetInput>;

/** Uncertainty of the level: the click σ of a level line's end points, or the ± tolerance of a stated roll. */
export const LevelUncertaintyInput = z.object({
  endpointSigmaPx: finite('endpointSigmaPx').refine((v) => v >= 0 && v <= 50, 'endpointSigmaPx must be between 0 and 50').optional(),
  rollTolDeg: finite('rollTolDeg').refine((v) => v >= 0 && v < 45, 'rollTolDeg must be between 0 and 45').optional(),
});

/** Exposure timing of a clip: shutter time and where in the exposure each frame's time stamp sits. */
export const FrameStamp = z.enum(FRAME_STAMP_POSITIONS);
export const ExposureInput = z.object({
  shutterS: finite('shutterS').refine((v) => v > 0 && v <= 1, 'shutterS must be a positive number of seconds (at most 1)').nullable(),
  frameStamp: FrameStamp.default('middle'),
});

/** Wind at the firing point, relative to the line of fire (shared/physics/wind.ts). */
export const WindInput = z.object({
  speedMps: finite('speedMps').refine((v) => v >= 0 && v <= 60, 'wind speed must be between 0 and 60 m/s'),
  /** Direction the wind comes FROM, degrees clockwise from the line of fire seen from above: 0 headwind, 90 from the right, 180 tailwind. */
  fromDeg: finite('fromDeg').refine((v) => v >= 0 && v < 360, 'fromDeg must be from 0 up to 360'),
});
export type WindInput = z.infer<typeof WindInput>;
