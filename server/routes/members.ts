import type { Request, Response } from 'express';
import { z } from 'zod';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import { Member, MemberParams, MemberRoleBody } from '../../shared/schemas/teams';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { changeMemberRole, membersOf, removeMember as removeTeamMember } from '../teams/members';

export function memberRoutes(api: RouteTable, { db }: AppDeps) {
  api.get('/api/teams/:teamId/members', { summary: 'Members of the team with their roles', response: z.array(Member) }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), listMembers);
  api.patch(
    '/api/teams/:teamId/members/:userId',
    { summary: "Change a member's role (the last admin cannot be demoted)", response: Member },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: MemberParams, body: MemberRoleBody }),
    changeRole,
  );
  api.delete(
    '/api/teams/:teamId/members/:userId',
    { summary: 'Remove a member (the last admin cannot be removed)', status: 204 },
    signedIn,
    teamRole(CAN.manageMembers),
    validate({ params: MemberParams }),
    removeMember,
  );

  async function listMembers(_req: Request, res: Response) {
    res.json(await membersOf(db, currentTeam(res).id));
  }

  async function changeRole(_req: Request, res: Response) {
    const { params, body } = input(res, { params: MemberParams, body: MemberRoleBody });
    res.json(await changeMemberRole(db, actorOf(res), params.userId, body.role));
  }

  async function removeMember(_req: Request, res: Response) {
    const { params } = input(res, { params: MemberParams });
    await removeTeamMember(db, actorOf(res), params.userId);
    res.status(204).end();
  }
}
