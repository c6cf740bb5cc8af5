import { z } from 'zod';
import type { FitInputSnapshot } from '../fits/snapshot';
import type { FitShotResult } from '../physics/types';
import { FIT_STATES, OVERVIEW_STATUSES } from './fits';
import { PersonRef } from './marking';
import { Uuid } from './common';

// What the fit routes answer, as zod, for the OpenAPI document and the contract
// check; the types in fits.ts are z.infer of these. The fit's result and input
// snapshot are plain data defined in shared/physics/types.ts and shared/fits/snapshot.ts:
// here their headline fields are described and the rest is allowed through (`loose`),
// and a compile-time check below keeps those types within what is described.

const IsoTimestamp = z.string().describe('ISO 8601 date and time');
const FitStateSchema = z.enum(FIT_STATES);

/** A fitted or derived number with its standard uncertainty and 95 % interval. */
export const EstimateSchema = z.object({ value: z.number(), stdErr: z.number(), ci95: z.tuple([z.number(), z.number()]) });

/** fitShot's result (shared/physics/types.ts FitShotResult): the numbers a reader needs first, the rest as stored. */
export const FitResultSchema = z
  .object({
    model: z.enum(['quadratic-drag', 'drag-free']),
    /** Time the launch state refers to (the first mark), s. */
    tRefS: z.number(),
    x0M: EstimateSchema,
    y0M: EstimateSchema,
    launchSpeedMps: EstimateSchema,
    launchAngleDeg: EstimateSchema,
    dragK_perM: EstimateSchema,
    dragCoefficient: EstimateSchema,
    rmsResidualM: z.number(),
    dragResolved: z.boolean(),
    dragVerdict: z.string(),
    degreesOfFreedom: z.number(),
    parameterNames: z.array(z.string()),
    correlation: z.array(z.array(z.number())),
    residuals: z.array(z.object({ tS: z.number(), xResidualM: z.number(), yResidualM: z.number(), outlier: z.boolean() })),
    outlierCount: z.number().int(),
    cautions: z.array(z.string()),
    iterations: z.number().int(),
    converged: z.boolean(),
  })
  .loose()
  .describe('The fit result (drag-free fit, model comparison, uncertainty breakdown, derived numbers, muzzle and gravity checks beside the fields listed)');

/** What the fit was run on (shared/fits/snapshot.ts FitInputSnapshot): recomputing from fitInput reproduces the result. */
export const FitSnapshotSchema = z
  .object({
    schemaVersion: z.literal(1),
    marks: z.array(z.object({ frameNumber: z.number().int(), tS: z.number(), uPx: z.number(), vPx: z.number(), xM: z.number(), yM: z.number() })),
    fitInput: z.object({ marks: z.array(z.object({ tS: z.number(), xM: z.number(), yM: z.number() }).loose()), massKg: z.number(), diameterM: z.number(), airDensityKgM3: z.number() }).loose(),
  })
  .loose()
  .describe('The input snapshot (shot, projectile, launcher, clip, calibration, track, air and uncertainty notes beside the fields listed)');

export const StalenessSchema = z.object({
  /** True when the marks or the calibration moved on after the fit ran. */
  inputsChanged: z.boolean(),
  marksChanged: z.boolean(),
  calibrationChanged: z.boolean(),
  currentMarksRevision: z.number().int().nullable(),
  currentCalibrationVersion: z.number().int().nullable(),
  message: z.string().nullable(),
});

export const FitAuditEntrySchema = z.object({
  action: z.string(),
  actor: PersonRef.nullable(),
  at: IsoTimestamp,
  detail: z.record(z.string(), z.unknown()),
});

export const FitSummaryResponse = z.object({
  id: Uuid,
  shotId: Uuid,
  trackId: Uuid,
  state: FitStateSchema,
  launchSpeedMps: z.number(),
  launchAngleDeg: z.number(),
  dragCoefficient: z.number().nullable(),
  dragK_perM: z.number().nullable(),
  rmsResidualM: z.number(),
  dragVerdict: z.string(),
  inputsChanged: z.boolean(),
  createdBy: PersonRef.nullable(),
  createdAt: IsoTimestamp,
  reviewedBy: PersonRef.nullable(),
  reviewedAt: IsoTimestamp.nullable(),
});

export const FitDetailResponse = FitSummaryResponse.extend({
  teamId: Uuid,
  clipId: Uuid,
  calibrationId: Uuid,
  calibrationVersion: z.number().int(),
  marksRevision: z.number().int(),
  inputHash: z.string(),
  reviewNote: z.string().nullable(),
  staleness: StalenessSchema,
  shot: z.object({ id: Uuid, label: z.string(), seriesName: z.string().nullable(), launcherName: z.string().nullable(), projectileName: z.string().nullable() }),
  result: FitResultSchema,
  snapshot: FitSnapshotSchema,
  audit: z.array(FitAuditEntrySchema),
  /** An earlier fit of this shot run on identical inputs (same input hash), or null. */
  sameInputsAs: z.object({ id: Uuid, number: z.number().int(), state: FitStateSchema, createdAt: IsoTimestamp }).nullable(),
});

export const ShotFitsResponse = z.object({
  shot: z.object({ id: Uuid, label: z.string(), seriesName: z.string().nullable() }),
  tracks: z.array(z.object({ id: Uuid, name: z.string(), kind: z.string(), clipId: Uuid, markCount: z.number().int() })),
  fits: z.array(FitSummaryResponse),
});

export const ReproduceReportResponse = z.object({
  identical: z.boolean(),
  inputHashMatches: z.boolean(),
  /** Paths of result fields that differ, e.g. "launchSpeedMps.value". Empty when identical. */
  differences: z.array(z.string()),
});

export const ShotOverviewRowResponse = z.object({
  shotId: Uuid,
  label: z.string(),
  seriesId: Uuid,
  seriesName: z.string(),
  /** YYYY-MM-DD */
  testDate: z.string(),
  launcherName: z.string().nullable(),
  projectileName: z.string().nullable(),
  createdAt: IsoTimestamp,
  status: z.enum(OVERVIEW_STATUSES),
  fitId: Uuid.nullable(),
  launchSpeedMps: z.number().nullable(),
  dragCoefficient: z.number().nullable(),
  fitCount: z.number().int(),
  /** The shot's latest approved fit, which may be older than the latest fit; null when none is approved. */
  approved: z.object({ fitId: Uuid, launchSpeedMps: z.number(), dragCoefficient: z.number().nullable() }).nullable(),
});

export const ShotOverviewPageResponse = z.object({
  items: z.array(ShotOverviewRowResponse),
  total: z.number().int().min(0),
  page: z.number().int().min(1),
  pageSize: z.number().int().min(1),
});

// Compile-time: the stored result and snapshot types stay within what the schemas describe.
// (`loose` adds an index signature to the inferred type, which interfaces never match; Known drops it.)
type Known<T> = T extends readonly unknown[] ? { [I in keyof T]: Known<T[I]> } : T extends object ? { [K in keyof T as string extends K ? never : K]: Known<T[K]> } : T;
type Within<A, B> = [A] extends [Known<B>] ? true : false;
const resultWithin: Within<FitShotResult, z.infer<typeof FitResultSchema>> = true;
const snapshotWithin: Within<FitInputSnapshot, z.infer<typeof FitSnapshotSchema>> = true;
void resultWithin;
void snapshotWithin;
