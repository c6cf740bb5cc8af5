import { z } from 'zod';
import { RoleSchema } from './auth';
import { Uuid } from './common';

// The team home: one queue per role of what waits for that role, what just
// happened, and how the team's approved numbers move per preset.

export const WORK_QUEUE_KEYS = [
  'clips-to-calibrate',
  'failed-extractions',
  'clips-to-mark',
  'flagged-auto-marks',
  'fits-awaiting-review',
  'tracks-ready-to-fit',
  'stale-fits',
  'pending-invitations',
] as const;
export const WorkQueueKey = z.enum(WORK_QUEUE_KEYS);
export type WorkQueueKey = z.infer<typeof WorkQueueKey>;

export const WorkItem = z.object({
  id: Uuid,
  label: z.string(),
  detail: z.string().nullable(),
  /** Path inside the app, e.g. /t/<team>/clips/<clip>/workspace. */
  href: z.string(),
  at: z.string(),
});
export type WorkItem = z.infer<typeof WorkItem>;

export const WorkQueue = z.object({
  key: WorkQueueKey,
  role: RoleSchema,
  title: z.string(),
  /** Everything waiting; items lists the oldest few. */
  count: z.number().int(),
  items: z.array(WorkItem),
});
export type WorkQueue = z.infer<typeof WorkQueue>;

export const ActivityEntry = z.object({
  id: Uuid,
  text: z.string(),
  actor: z.string().nullable(),
  at: z.string(),
  href: z.string().nullable(),
  /** A frame of the clip it concerns, when there is one (thumbnail index of that clip). */
  thumbnail: z.object({ clipId: Uuid, n: z.number().int() }).nullable(),
});
export type ActivityEntry = z.infer<typeof ActivityEntry>;

export const TrendPoint = z.object({
  fitId: Uuid,
  shotLabel: z.string(),
  /** When the fit was approved. */
  at: z.string(),
  dragCoefficient: z.number().nullable(),
  /** Measured speed over the launcher model's (adiabatic when the chamber volume is known, else constant pressure). */
  launcherEfficiency: z.number().nullable(),
});
export type TrendPoint = z.infer<typeof TrendPoint>;

export const PresetTrend = z.object({ presetId: Uuid, name: z.string(), points: z.array(TrendPoint) });
export type PresetTrend = z.infer<typeof PresetTrend>;

export const WorkQueues = z.object({
  queues: z.array(WorkQueue),
  activity: z.array(ActivityEntry),
  trends: z.array(PresetTrend),
});
export type WorkQueues = z.infer<typeof WorkQueues>;
