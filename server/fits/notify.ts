// E-mail about fits. Who hears what: everyone who may review (CAN.review) when a
// fit awaits review, and the person who ran the fit when it is approved or
// rejected. Users who turned notifications off (users.notify_by_email) are skipped.
import { and, eq, inArray, ne } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import type { AppDeps } from '../app-deps';
import { memberships } from '../db/schema/teams';
import { users } from '../db/schema/users';

export interface FitMailContext {
  teamId: string;
  teamName: string;
  fitId: string;
  shotLabel: string;
  launchSpeedMps: number;
  dragCoefficient: number | null;
}

export function fitLink(publicUrl: string, teamId: string, fitId: string): string {
  return `${publicUrl.replace(/\/$/, '')}/t/${teamId}/fits/${fitId}`;
}

function headline(ctx: FitMailContext): string {
  const cd = ctx.dragCoefficient === null ? 'not resolved' : ctx.dragCoefficient.toFixed(3);
  return `Launch speed ${ctx.launchSpeedMps.toFixed(2)} m/s, drag coefficient ${cd}.`;
}

/** Sends one message per recipient; a mail failure is logged, never undoes the fit or the review. */
async function sendAll(deps: Pick<AppDeps, 'mailer'>, to: string[], subject: string, text: string, teamId: string, kind: string) {
  for (const address of to) {
    try {
      await deps.mailer.send({ to: address, subject, text, teamId, kind });
    } catch (err) {
      console.error(`[fits] could not send ${kind} mail to ${address}:`, err);
    }
  }
}

export async function notifyAwaitingReview(deps: Pick<AppDeps, 'db' | 'mailer' | 'config'>, ctx: FitMailContext, runByUserId: string) {
  const reviewers = await deps.db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.teamId, ctx.teamId),
        inArray(memberships.role, [...CAN.review]),
        eq(users.notifyByEmail, true),
        ne(users.id, runByUserId),
      ),
    );
  const text = [
    `A fit of shot "${ctx.shotLabel}" in ${ctx.teamName} is waiting for your review.`,
    '',
    headline(ctx),
    '',
    `Open it: ${fitLink(deps.config.publicUrl, ctx.teamId, ctx.fitId)}`,
    '',
    'You get this because you can review fits. Turn these messages off under your account settings.',
  ].join('\n');
  await sendAll(deps, reviewers.map((r) => r.email), `Fit awaiting review: ${ctx.shotLabel}`, text, ctx.teamId, 'fit-awaiting-review');
}

export async function notifyReviewed(
  deps: Pick<AppDeps, 'db' | 'mailer' | 'config'>,
  ctx: FitMailContext,
  decision: 'approve' | 'reject',
  runByUserId: string | null,
  reviewer: { id: string; displayName: string },
  note: string,
) {
  if (!runByUserId || runByUserId === reviewer.id) return;
  const [runner] = await deps.db.select({ email: users.email, notify: users.notifyByEmail }).from(users).where(eq(users.id, runByUserId));
  if (!runner || !runner.notify) return;
  const word = decision === 'approve' ? 'approved' : 'rejected';
  const text = [
    `${reviewer.displayName} ${word} your fit of shot "${ctx.shotLabel}" in ${ctx.teamName}.`,
    '',
    headline(ctx),
    note ? `\nNote: ${note}\n` : '',
    `Open it: ${fitLink(deps.config.publicUrl, ctx.teamId, ctx.fitId)}`,
    '',
    'Turn these messages off under your account settings.',
  ].join('\n');
  await sendAll(deps, [runner.email], `Fit ${word}: ${ctx.shotLabel}`, text, ctx.teamId, `fit-${word}`);
}
