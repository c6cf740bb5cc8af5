// Runs after express-session on every request of a signed-in session:
// - an absolute lifetime (config.sessionAbsoluteMs, 12 h in production) on top
//   of the rolling idle timeout of the cookie, so a session kept busy cannot live for ever;
// - a new session id whenever the user's memberships or roles change (common
//   practice, OWASP Session Management Cheat Sheet: renew the id on any privilege
//   change), so an id seen before the change does not carry the new rights.
import { createHash } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type { Request, RequestHandler } from 'express';
import type { Db } from '../db/client';
import { memberships } from '../db/schema/teams';

export async function roleStamp(db: Db, userId: string): Promise<string> {
  const rows = await db
    .select({ teamId: memberships.teamId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.teamId));
  return createHash('sha256').update(rows.map((r) => `${r.teamId}:${r.role}`).join(',')).digest('base64url').slice(0, 16);
}

const regenerate = (req: Request) => new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
const destroy = (req: Request) => new Promise<void>((resolve) => req.session.destroy(() => resolve()));

/**
 * For a request that changed the caller's own memberships (creating a team):
 * the new session id goes out with this answer. Left to the guard, the next
 * requests would race: the first renews the id and the others, still carrying
 * the old one, would find their session gone.
 */
export async function renewSessionAfterOwnRoleChange(db: Db, req: Request): Promise<void> {
  const { userId, signedInAt } = req.session;
  if (!userId) return;
  await regenerate(req);
  Object.assign(req.session, { userId, signedInAt, roleStamp: await roleStamp(db, userId) });
}

export function sessionGuard(db: Db, absoluteMs: number): RequestHandler {
  return async (req, _res, next) => {
    try {
      const s = req.session;
      if (!s?.userId) return next();
      const now = Date.now();
      s.signedInAt ??= now;
      if (now - s.signedInAt > absoluteMs) {
        await destroy(req);
        return next();
      }
      const stamp = await roleStamp(db, s.userId);
      if (s.roleStamp === undefined) s.roleStamp = stamp;
      else if (s.roleStamp !== stamp) {
        const { userId, signedInAt } = s;
        await regenerate(req);
        Object.assign(req.session, { userId, signedInAt, roleStamp: stamp });
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}
