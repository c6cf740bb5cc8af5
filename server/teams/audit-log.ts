import { count, desc, eq } from 'drizzle-orm';
import type { PageQuery } from '../../shared/schemas/common';
import type { AuditPage } from '../../shared/schemas/teams';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema/audit-events';
import { users } from '../db/schema/users';

/** One page of the team's audit log (who did what), newest first. */
export async function teamAuditPage(db: Db, teamId: string, query: PageQuery): Promise<AuditPage> {
  const where = eq(auditEvents.teamId, teamId);
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({
        id: auditEvents.id,
        action: auditEvents.action,
        actorId: users.id,
        actorName: users.displayName,
        targetType: auditEvents.targetType,
        targetId: auditEvents.targetId,
        detail: auditEvents.detail,
        createdAt: auditEvents.createdAt,
      })
      .from(auditEvents)
      .leftJoin(users, eq(users.id, auditEvents.actorUserId))
      .where(where)
      .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db.select({ total: count() }).from(auditEvents).where(where),
  ]);
  return {
    items: rows.map((r) => ({
      id: r.id,
      action: r.action,
      actor: r.actorId && r.actorName ? { id: r.actorId, displayName: r.actorName } : null,
      targetType: r.targetType,
      targetId: r.targetId,
      detail: r.detail,
      createdAt: r.createdAt.toISOString(),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}
