// The daily digest: one mail per person and team listing the hand-off events queued
// for them since their last digest. Safe to run twice or in two processes at once:
// rows are claimed with SKIP LOCKED and stamped sent in the same transaction, so an
// event is listed in exactly one digest.
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import type { AppDeps } from '../app-deps';
import { pendingNotifications } from '../db/schema/notifications';
import { teams } from '../db/schema/teams';
import { users } from '../db/schema/users';

export interface DigestReport {
  /** Mails sent (one per person and team). */
  mails: number;
  /** Events listed in them. */
  events: number;
}

export async function sendDailyDigests(deps: Pick<AppDeps, 'db' | 'mailer'>, now = new Date()): Promise<DigestReport> {
  return deps.db.transaction(async (tx) => {
    const rows = await tx
      .select({ id: pendingNotifications.id, userId: pendingNotifications.userId, teamId: pendingNotifications.teamId, subject: pendingNotifications.subject, text: pendingNotifications.textBody, createdAt: pendingNotifications.createdAt })
      .from(pendingNotifications)
      .where(isNull(pendingNotifications.sentAt))
      .orderBy(asc(pendingNotifications.createdAt))
      .for('update', { skipLocked: true });
    if (rows.length === 0) return { mails: 0, events: 0 };
    const people = await tx.select({ id: users.id, email: users.email, mode: users.notificationMode }).from(users).where(inArray(users.id, [...new Set(rows.map((r) => r.userId))]));
    const teamNames = new Map((await tx.select({ id: teams.id, name: teams.name }).from(teams).where(inArray(teams.id, [...new Set(rows.map((r) => r.teamId))]))).map((t) => [t.id, t.name]));
    const groups = new Map<string, typeof rows>();
    for (const row of rows) {
      const key = `${row.userId}|${row.teamId}`;
      groups.set(key, [...(groups.get(key) ?? []), row]);
    }
    let mails = 0;
    for (const [key, events] of groups) {
      const [userId, teamId] = key.split('|');
      const person = people.find((p) => p.id === userId);
      // Someone who switched to 'none' since the events were queued gets nothing; the rows are still closed.
      if (person && person.mode !== 'none') {
        const team = teamNames.get(teamId) ?? 'your team';
        const body = [
          `What reached you in ${team} since your last digest (${events.length} ${events.length === 1 ? 'event' : 'events'}):`,
          '',
          ...events.flatMap((e, i) => [`${i + 1}. ${e.subject}`, e.text.split('\n').map((l) => `   ${l}`).join('\n'), '']),
          'You get one digest a day because you chose it under Settings.',
        ].join('\n');
        try {
          await deps.mailer.send({ to: person.email, subject: `Daily digest: ${events.length} ${events.length === 1 ? 'item' : 'items'} in ${team}`, text: body, teamId, kind: 'daily-digest' });
          mails++;
        } catch (err) {
          // Left unsent: the next run lists these events again.
          console.error('[notifications] could not send a digest:', (err as Error).message);
          continue;
        }
      }
      await tx.update(pendingNotifications).set({ sentAt: now }).where(and(inArray(pendingNotifications.id, events.map((e) => e.id)), eq(pendingNotifications.userId, userId)));
    }
    return { mails, events: rows.length };
  });
}
