import { z } from 'zod';
import { Uuid } from './common';

// Contract of automatic marking: a job that finds the projectile on a track's
// clip and follows it, writing marks as it decides them; a person then reviews
// only the frames it was unsure about. Pixel coordinates as everywhere else:
// u right, v down, frame pixels.

/** Who placed a mark: a person by hand, a person with the snap, or the automatic marker. */
export const MARK_SOURCES = ['hand', 'snap', 'auto'] as const;
export const MarkSource = z.enum(MARK_SOURCES);
export type MarkSource = z.infer<typeof MarkSource>;

export const MARK_SOURCE_LABELS: Record<MarkSource, string> = {
  hand: 'By hand',
  snap: 'Snapped',
  auto: 'Automatic',
};

/** Review threshold when a team has set none: auto marks below it are flagged and left out of fits. */
export const DEFAULT_REVIEW_THRESHOLD = 0.6;

/** True when an automatic mark needs a person's look (and stays out of fits until one gives it). */
export function isFlagged(mark: { source: MarkSource; confidence: number | null }, threshold: number): boolean {
  return mark.source === 'auto' && mark.confidence !== null && mark.confidence < threshold;
}

export const AUTO_MARK_STATES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export const AutoMarkState = z.enum(AUTO_MARK_STATES);
export type AutoMarkState = z.infer<typeof AutoMarkState>;
export const ACTIVE_AUTO_MARK_STATES: readonly AutoMarkState[] = ['queued', 'running'];

/** Why following the projectile stopped. */
export const AUTO_MARK_END_REASONS = ['left-frame', 'lost', 'end-of-clip'] as const;
export const AutoMarkEndReason = z.enum(AUTO_MARK_END_REASONS);
export type AutoMarkEndReason = z.infer<typeof AutoMarkEndReason>;

export const AUTO_MARK_END_LABELS: Record<AutoMarkEndReason, string> = {
  'left-frame': 'the projectile left the picture',
  lost: 'the projectile could not be found again',
  'end-of-clip': 'the clip ended',
};

const frame = z.number({ error: 'must be a number' }).int('must be a whole frame number').min(0, 'must be 0 or more').max(10_000_000);
const pixel = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);

export const AutoMarkSeed = z.object({ frameNumber: frame, uPx: pixel('uPx'), vPx: pixel('vPx') });
export type AutoMarkSeed = z.infer<typeof AutoMarkSeed>;

export const AutoMarkBody = z
  .object({
    /** One click on the projectile; without it the marker finds the projectile itself. */
    seed: AutoMarkSeed.optional(),
    fromFrame: frame.optional(),
    toFrame: frame.optional(),
    /** true: marks a person placed may be overwritten too. */
    replace: z.boolean().default(false),
  })
  .refine((b) => b.fromFrame === undefined || b.toFrame === undefined || b.fromFrame <= b.toFrame, {
    message: 'toFrame must not be before fromFrame',
    path: ['toFrame'],
  });
export type AutoMarkBody = z.input<typeof AutoMarkBody>;

export const AutoMarkTrackParams = z.object({ teamId: Uuid, trackId: Uuid });
export const AutoMarkRunParams = z.object({ teamId: Uuid, runId: Uuid });

export const AutoMarkStarted = z.object({ runId: Uuid });
export type AutoMarkStarted = z.infer<typeof AutoMarkStarted>;

export const AutoMarkRun = z.object({
  id: Uuid,
  trackId: Uuid,
  clipId: Uuid,
  state: AutoMarkState,
  /** 0 … 1 */
  progress: z.number(),
  framesMarked: z.number().int(),
  /** Marks below the team's review threshold. */
  framesFlagged: z.number().int(),
  /** First frame of flight, when found. */
  launchFrame: z.number().int().nullable(),
  endReason: AutoMarkEndReason.nullable(),
  error: z.string().nullable(),
  request: z.object({ seed: AutoMarkSeed.nullable(), fromFrame: z.number().int().nullable(), toFrame: z.number().int().nullable(), replace: z.boolean() }),
  /** The threshold the flags were counted against. */
  reviewThreshold: z.number(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type AutoMarkRun = z.infer<typeof AutoMarkRun>;

export const AutoMarkRunList = z.object({ runs: z.array(AutoMarkRun) });
export type AutoMarkRunList = z.infer<typeof AutoMarkRunList>;

/** The team's review threshold, 0 … 1. */
export const AutoMarkSettings = z.object({
  reviewThreshold: z.number({ error: 'must be a number' }).min(0, 'must be 0 or more').max(1, 'must be 1 or less'),
});
export type AutoMarkSettings = z.infer<typeof AutoMarkSettings>;

/** How a fit's marks were made and which it left out (stored with the fit's input). */
export const FitMarkCounts = z.object({
  automatic: z.number().int(),
  byHand: z.number().int(),
  leftOut: z.number().int(),
  reviewThreshold: z.number(),
  leftOutFrames: z.array(z.object({ frameNumber: z.number().int(), confidence: z.number(), reason: z.string().nullable() })),
});
export type FitMarkCounts = z.infer<typeof FitMarkCounts>;
