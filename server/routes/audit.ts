import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { PageQuery, TeamParams } from '../../shared/schemas/common';
import { AuditPage } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { teamAuditPage } from '../teams/audit-log';

export function auditRoutes(api: RouteTable, { db }: AppDeps) {
  api.get(
    '/api/teams/:teamId/audit',
    { summary: "The team's audit log (who did what), newest first", response: AuditPage },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: TeamParams, query: PageQuery }),
    teamAudit,
  );

  async function teamAudit(_req: Request, res: Response) {
    const { query } = input(res, { params: TeamParams, query: PageQuery });
    res.json(await teamAuditPage(db, currentTeam(res).id, query));
  }
}
