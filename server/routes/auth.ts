import type { Request, Response } from 'express';
import { eq } from 'drizzle-orm';
import { rateLimit } from 'express-rate-limit';
import { MeUpdateBody, SignInBody } from '../../shared/schemas/auth';
import type { AppDeps } from '../app-deps';
import { audit } from '../audit';
import { open, signedIn } from '../auth/access';
import { loadMe } from '../auth/me';
import { verifyPassword } from '../auth/passwords';
import { users } from '../db/schema/users';
import { currentUser, input } from '../http/input';
import { HttpProblem, sendProblem, unauthorized } from '../http/problem';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';

export function authRoutes(api: RouteTable, { db, config }: AppDeps) {
  const signInLimit = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: config.signInLimitPerWindow,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, res) =>
      sendProblem(res, new HttpProblem(429, 'Too many sign-in attempts', 'Too many sign-in attempts from this address. Wait 15 minutes and try again.'), req.originalUrl),
  });

  api.post('/api/auth/sign-in', 'Sign in with e-mail and password', open, signInLimit, validate({ body: SignInBody }), signIn);
  api.post('/api/auth/sign-out', { summary: 'Sign out (destroys the session)', status: 204 }, open, signOut);
  api.get('/api/auth/me', 'The signed-in user and their teams', signedIn, me);
  api.patch('/api/auth/me', 'Change my name or e-mail notification setting', signedIn, validate({ body: MeUpdateBody }), updateMe);

  async function signIn(req: Request, res: Response) {
    const { body } = input(res, { body: SignInBody });
    const [user] = await db.select({ id: users.id, passwordHash: users.passwordHash }).from(users).where(eq(users.email, body.email));
    const ok = await verifyPassword(user?.passwordHash ?? null, body.password);
    // One message for both failures, so the form does not reveal who has an account.
    if (!user || !ok) throw unauthorized('E-mail or password is not right.');
    // A new session id at sign-in defeats session fixation.
    await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
    req.session.userId = user.id;
    await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
    await audit(db, { actorUserId: user.id, action: 'auth.sign-in' });
    res.json(await loadMe(db, user.id));
  }

  async function signOut(req: Request, res: Response) {
    if (!req.session) return void res.status(204).end();
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('arcbench.sid', { httpOnly: true, sameSite: 'lax' });
    res.status(204).end();
  }

  async function me(_req: Request, res: Response) {
    res.json(await loadMe(db, currentUser(res).id));
  }

  async function updateMe(_req: Request, res: Response) {
    const { body } = input(res, { body: MeUpdateBody });
    const user = currentUser(res);
    await db.update(users).set(body).where(eq(users.id, user.id));
    res.json(await loadMe(db, user.id));
  }
}
