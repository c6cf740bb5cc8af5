import type { Request, Response } from 'express';
import { Me, MeUpdateBody, SignInBody } from '../../shared/schemas/auth';
import type { AppDeps } from '../app-deps';
import { open, signedIn } from '../auth/access';
import { loadMe } from '../auth/me';
import { signIn as checkAndSignIn, updateMe } from '../auth/sign-in';
import { currentUser, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { SIGN_IN_EXAMPLE } from '../http/api-examples';

export function authRoutes(api: RouteTable, { db }: AppDeps) {
  // Failed attempts are limited per account and per address by signInGuard (app.ts), which runs before this route.
  api.post('/api/auth/sign-in', { summary: 'Sign in with e-mail and password', response: Me, example: SIGN_IN_EXAMPLE }, open, validate({ body: SignInBody }), signIn);
  api.post('/api/auth/sign-out', { summary: 'Sign out (destroys the session)', status: 204 }, open, signOut);
  api.get('/api/auth/me', { summary: 'The signed-in user and their teams', response: Me }, signedIn, me);
  api.patch('/api/auth/me', { summary: 'Change my name or e-mail notification setting', response: Me }, signedIn, validate({ body: MeUpdateBody }), changeMe);

  async function signIn(req: Request, res: Response) {
    const { body } = input(res, { body: SignInBody });
    const userId = await checkAndSignIn(db, body, async (id) => {
      // A new session id at sign-in defeats session fixation.
      await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
      req.session.userId = id;
      await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
    });
    res.json(await loadMe(db, userId));
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

  async function changeMe(_req: Request, res: Response) {
    const { body } = input(res, { body: MeUpdateBody });
    const user = currentUser(res);
    await updateMe(db, user.id, body);
    res.json(await loadMe(db, user.id));
  }
}
