import { z } from 'zod';
import type { FitInputSnapshot } from '../fits/snapshot';
import type { FitShotResult } from '../physics/types';
import { INT4_MAX, Uuid } from './common';

// Fits: running a track's fit, reading it, signing it off, and the team's shot overview.

export const FIT_STATES = ['awaiting-review', 'approved', 'rejected', 'stale'] as const;
export type FitState = (typeof FIT_STATES)[number];

export const FIT_STATE_LABELS: Record<FitState, string> = {
  'awaiting-review': 'Awaiting review',
  approved: 'Approved',
  rejected: 'Rejected',
  stale: 'Inputs changed',
};

export const TrackFitParams = z.object({ teamId: Uuid, trackId: Uuid });
export const FitParams = z.object({ teamId: Uuid, fitId: Uuid });
export const ShotFitsParams = z.object({ teamId: Uuid, shotId: Uuid });

export const ReviewDecision = z.enum(['approve', 'reject']);
export const FitReviewBody = z
  .object({
    decision: ReviewDecision,
    note: z.string().trim().max(2000, 'must be at most 2000 characters').default(''),
  })
  // A rejection without a reason leaves the analyst guessing what to fix.
  .refine((v) => v.decision === 'approve' || v.note.length > 0, { message: 'is required when rejecting', path: ['note'] });
export type FitReviewBody = z.input<typeof FitReviewBody>;

export const OVERVIEW_STATUSES = ['no-fit', ...FIT_STATES] as const;
export type OverviewStatus = (typeof OVERVIEW_STATUSES)[number];

export const ShotOverviewQuery = z.object({
  q: z.string().trim().max(120).optional(),
  status: z.enum(OVERVIEW_STATUSES).optional(),
  seriesId: Uuid.optional(),
  launcherId: Uuid.optional(),
  projectileId: Uuid.optional(),
  sort: z.enum(['created', 'label', 'series', 'speed', 'cd', 'status']).default('created'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).max(INT4_MAX).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type ShotOverviewQuery = z.input<typeof ShotOverviewQuery>;

export interface PersonRef {
  id: string;
  displayName: string;
}

export interface Staleness {
  /** True when the marks or the calibration moved on after the fit ran. */
  inputsChanged: boolean;
  marksChanged: boolean;
  calibrationChanged: boolean;
  currentMarksRevision: number | null;
  currentCalibrationVersion: number | null;
  message: string | null;
}

export interface FitAuditEntry {
  action: string;
  actor: PersonRef | null;
  at: string;
  detail: Record<string, unknown>;
}

export interface FitSummary {
  id: string;
  shotId: string;
  trackId: string;
  state: FitState;
  launchSpeedMps: number;
  launchAngleDeg: number;
  dragCoefficient: number | null;
  dragK_perM: number | null;
  rmsResidualM: number;
  dragVerdict: string;
  inputsChanged: boolean;
  createdBy: PersonRef | null;
  createdAt: string;
  reviewedBy: PersonRef | null;
  reviewedAt: string | null;
}

export interface FitDetail extends FitSummary {
  teamId: string;
  clipId: string;
  calibrationId: string;
  calibrationVersion: number;
  marksRevision: number;
  inputHash: string;
  reviewNote: string | null;
  staleness: Staleness;
  shot: { id: string; label: string; seriesName: string | null; launcherName: string | null; projectileName: string | null };
  result: FitShotResult;
  snapshot: FitInputSnapshot;
  audit: FitAuditEntry[];
  /** An earlier fit of this shot run on identical inputs (same input hash), or null. */
  sameInputsAs: { id: string; number: number; state: FitState; createdAt: string } | null;
}

export interface ShotFits {
  shot: { id: string; label: string; seriesName: string | null };
  tracks: { id: string; name: string; kind: string; clipId: string; markCount: number }[];
  fits: FitSummary[];
}

export interface ReproduceReport {
  identical: boolean;
  inputHashMatches: boolean;
  /** Paths of result fields that differ, e.g. "launchSpeedMps.value". Empty when identical. */
  differences: string[];
}

export interface ShotOverviewRow {
  shotId: string;
  label: string;
  seriesId: string;
  seriesName: string;
  testDate: string;
  launcherName: string | null;
  projectileName: string | null;
  createdAt: string;
  status: OverviewStatus;
  fitId: string | null;
  launchSpeedMps: number | null;
  dragCoefficient: number | null;
  fitCount: number;
  /** The shot's latest approved fit, which may be older than the latest fit; null when none is approved. */
  approved: { fitId: string; launchSpeedMps: number; dragCoefficient: number | null } | null;
}

export interface ShotOverviewPage {
  items: ShotOverviewRow[];
  total: number;
  page: number;
  pageSize: number;
}
