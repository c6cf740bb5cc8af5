import type { Db } from './db/client';
import { auditEvents } from './db/schema/audit-events';

export interface AuditEntry {
  teamId?: string | null;
  actorUserId?: string | null;
  action: string;
  targetType?: string;
  targetId?: string;
  detail?: Record<string, unknown>;
}

/** Appends to the audit log. Pass the transaction when the change itself is in one. */
export async function audit(db: Pick<Db, 'insert'>, entry: AuditEntry): Promise<void> {
  await db.insert(auditEvents).values({
    teamId: entry.teamId ?? null,
    actorUserId: entry.actorUserId ?? null,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    detail: entry.detail ?? {},
  });
}
