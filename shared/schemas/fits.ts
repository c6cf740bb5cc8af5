import { z } from 'zod';
import type { FitInputSnapshot } from '../fits/snapshot';
import type { FitShotResult } from '../physics/types';
import { INT4_MAX, Uuid } from './common';
import type {
  FitAuditEntrySchema,
  FitDetailResponse,
  FitSummaryResponse,
  ReproduceReportResponse,
  ShotFitsResponse,
  ShotOverviewPageResponse,
  ShotOverviewRowResponse,
  StalenessSchema,
} from './fit-responses';

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

export type Staleness = z.infer<typeof StalenessSchema>;
export type FitAuditEntry = z.infer<typeof FitAuditEntrySchema>;
export type FitSummary = z.infer<typeof FitSummaryResponse>;
/** result and snapshot keep their full types from shared/physics and shared/fits; the wire schema describes their headline fields. */
export type FitDetail = Omit<z.infer<typeof FitDetailResponse>, 'result' | 'snapshot'> & { result: FitShotResult; snapshot: FitInputSnapshot };
export type ShotFits = z.infer<typeof ShotFitsResponse>;
export type ReproduceReport = z.infer<typeof ReproduceReportResponse>;
export type ShotOverviewRow = z.infer<typeof ShotOverviewRowResponse>;
export type ShotOverviewPage = z.infer<typeof ShotOverviewPageResponse>;
