import type { Request, Response } from 'express';
import { count, desc, eq } from 'drizzle-orm';
import { CAN } from '../../shared/roles';
import { PageQuery, TeamParams } from '../../shared/schemas/common';
import type { AuditPage } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { auditEvents } from '../db/schema/audit-events';
import { users } from '../db/schema/users';
import { currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

export function auditRoutes(api: RouteTable, { db }: AppDeps) {
  api.get(
    '/api/teams/:teamId/audit',
    "The team's audit log (who did what), newest first",
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: TeamParams, query: PageQuery }),
    teamAudit,
  );

  async function teamAudit(_req: Request, res: Response) {
    const { query } = input(res, { params: TeamParams, query: PageQuery });
    const where = eq(auditEvents.teamId, currentTeam(res).id);
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
    const page: AuditPage = {
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
    res.json(page);
  }
}
