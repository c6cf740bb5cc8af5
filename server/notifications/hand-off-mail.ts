// Telling people that work reached them. Each person chose how (users.notification_mode):
// 'none' hears nothing, 'each' gets one mail per event, 'digest' gets the event queued
// for the daily digest (send-digests.ts). A mail failure is logged and never undoes the
// work that caused it.
import { and, eq, inArray, ne } from 'drizzle-orm';
import type { Role } from '../../shared/roles';
import type { AppDeps } from '../app-deps';
import type { Db } from '../db/client';
import { pendingNotifications } from '../db/schema/notifications';
import { memberships } from '../db/schema/teams';
import { users } from '../db/schema/users';

export interface HandOffEvent {
  teamId: string;
  /** What it is about, e.g. 'clip-ready-to-mark'; also the mail's kind in the outbox. */
  kind: string;
  subject: string;
  text: string;
}

type MailDeps = Pick<AppDeps, 'db' | 'mailer'>;

const FOOTER = '\n\nChoose none, each event or a daily digest under Settings (You → Settings).';

/** Ids of the team's members in any of these roles, without the one who caused the event. */
export async function membersInRoles(db: Db, teamId: string, roles: readonly Role[], except: string | null): Promise<string[]> {
  const rows = await db
    .select({ id: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), inArray(memberships.role, [...roles]), except ? ne(memberships.userId, except) : undefined));
  return rows.map((r) => r.id);
}

/** Sends or queues the event for each person, as each chose. Returns how many got a mail now. */
export async function notifyPeople(deps: MailDeps, userIds: readonly string[], event: HandOffEvent): Promise<number> {
  const ids = [...new Set(userIds)];
  if (ids.length === 0) return 0;
  const people = await deps.db.select({ id: users.id, email: users.email, mode: users.notificationMode }).from(users).where(inArray(users.id, ids));
  let sent = 0;
  for (const person of people) {
    if (person.mode === 'none') continue;
    if (person.mode === 'digest') {
      await deps.db.insert(pendingNotifications).values({ userId: person.id, teamId: event.teamId, kind: event.kind, subject: event.subject, textBody: event.text });
      continue;
    }
    try {
      await deps.mailer.send({ to: person.email, subject: event.subject, text: event.text + FOOTER, teamId: event.teamId, kind: event.kind });
      sent++;
    } catch (err) {
      console.error(`[notifications] could not send ${event.kind} mail:`, (err as Error).message);
    }
  }
  return sent;
}

/** A link into the app for mails. */
export function appLink(publicUrl: string, path: string): string {
  return `${publicUrl.replace(/\/$/, '')}${path}`;
}
