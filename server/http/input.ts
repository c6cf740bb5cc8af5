import type { Response } from 'express';
import type { Actor } from '../auth/actor';
import type { Parsed, Schemas } from './validate';

/** The validated input of the request; `schemas` names the same schemas the route's validate() used, for typing only. */
export function input<S extends Schemas>(res: Response, _schemas: S): Parsed<S> {
  return res.locals.input as Parsed<S>;
}

export function currentUser(res: Response) {
  const user = res.locals.user;
  if (!user) throw new Error('currentUser() used on a route without signedIn');
  return user;
}

export function currentTeam(res: Response) {
  const team = res.locals.team;
  if (!team) throw new Error('currentTeam() used on a route without teamRole()');
  return team;
}

/** The signed-in user acting in the team of the path, as services take it. */
export function actorOf(res: Response): Actor {
  return { teamId: currentTeam(res).id, userId: currentUser(res).id };
}
