import type { RequestHandler } from 'express';
import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import type { Role } from '../../shared/roles';
import { memberships, teams } from '../db/schema/teams';
import { users } from '../db/schema/users';
import type { Access } from '../http/route-table';
import { forbidden, notFound, unauthorized } from '../http/problem';
import type { AppDeps } from '../app-deps';

function tag(handler: RequestHandler, access: Access): RequestHandler & { access: Access } {
  return Object.assign(handler, { access });
}

function depsOf(req: Parameters<RequestHandler>[0]): AppDeps {
  return req.app.locals.deps as AppDeps;
}

/** Anyone may call the route; stated explicitly so no route is public by accident. */
export const open = tag((_req, _res, next) => next(), { kind: 'public' });

export const signedIn = tag(async (req, res, next) => {
  const userId = req.session?.userId;
  if (!userId) return next(unauthorized());
  const { db } = depsOf(req);
  const [user] = await db
    .select({ id: users.id, email: users.email, displayName: users.displayName, notificationMode: users.notificationMode })
    .from(users)
    .where(eq(users.id, userId));
  if (!user) {
    req.session.destroy(() => {});
    return next(unauthorized('Your account no longer exists. Sign in again.'));
  }
  res.locals.user = user;
  next();
}, { kind: 'signed-in' });

const teamIdSchema = z.uuid();

/** Requires membership of the team in `:teamId` with one of `roles`. Must follow signedIn. */
export function teamRole(roles: readonly Role[]) {
  return tag(async (req, res, next) => {
    const user = res.locals.user;
    if (!user) return next(unauthorized());
    const teamId = String(req.params.teamId);
    if (!teamIdSchema.safeParse(teamId).success) return next(notFound('No such team.'));
    const { db } = depsOf(req);
    const [row] = await db
      .select({ role: memberships.role, teamName: teams.name })
      .from(memberships)
      .innerJoin(teams, eq(teams.id, memberships.teamId))
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, user.id)));
    if (!row) return next(forbidden('You are not a member of this team.'));
    if (!roles.includes(row.role)) {
      return next(forbidden(`Your role in ${row.teamName} (${row.role}) cannot do this; it needs ${roles.join(' or ')}.`));
    }
    res.locals.team = { id: teamId, name: row.teamName, role: row.role };
    next();
  }, { kind: 'team', roles });
}
