// The team's review threshold: automatic marks below it are flagged for a
// person's look and left out of fits until one accepts or moves them.
import { eq } from 'drizzle-orm';
import { DEFAULT_REVIEW_THRESHOLD, type AutoMarkSettings } from '../../shared/schemas/auto-mark';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { teams } from '../db/schema/teams';
import { notFound } from '../http/problem';

type Reader = Pick<Db, 'select'>;

/** float4 → the decimal a person typed (0.6, not 0.6000000238). */
const tidy = (v: number) => Math.round(v * 1e6) / 1e6;

export async function reviewThresholdOf(db: Reader, teamId: string): Promise<number> {
  const [team] = await db.select({ threshold: teams.autoMarkReviewThreshold }).from(teams).where(eq(teams.id, teamId));
  return team ? tidy(team.threshold) : DEFAULT_REVIEW_THRESHOLD;
}

export async function getAutoMarkSettings(db: Db, teamId: string): Promise<AutoMarkSettings> {
  return { reviewThreshold: await reviewThresholdOf(db, teamId) };
}

export async function setAutoMarkSettings(db: Db, actor: { teamId: string; userId: string }, settings: AutoMarkSettings): Promise<AutoMarkSettings> {
  const before = await reviewThresholdOf(db, actor.teamId);
  const rows = await db.update(teams).set({ autoMarkReviewThreshold: settings.reviewThreshold }).where(eq(teams.id, actor.teamId)).returning({ id: teams.id });
  if (rows.length === 0) throw notFound('No such team.');
  await audit(db, { teamId: actor.teamId, actorUserId: actor.userId, action: 'team.auto-mark-settings', targetType: 'team', targetId: actor.teamId, detail: { before, after: settings.reviewThreshold } });
  return getAutoMarkSettings(db, actor.teamId);
}
