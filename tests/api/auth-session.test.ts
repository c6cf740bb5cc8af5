import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../server/db/schema/users';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { argon2Params } from '../support/argon2-params';
import { expectProblem } from '../support/problem';
import { agent, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
});
afterAll(() => t.close());

const viewer = demoPerson('viewer');

function sessionCookie(res: request.Response): string {
  const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('arcbench.sid='));
  if (!raw) throw new Error('no arcbench.sid cookie was set');
  return raw;
}
const cookieValue = (setCookie: string) => setCookie.split(';')[0];

async function signIn() {
  const res = await request(t.app).post('/api/auth/sign-in').set('X-Arcbench-Request', '1').send({ email: viewer.email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return cookieValue(sessionCookie(res));
}

const me = (cookie: string) => request(t.app).get('/api/auth/me').set('Cookie', cookie);

describe('sign-in and sign-out', () => {
  it('signs in, reports the user and their teams, and signs out', async () => {
    const a = agent(t.app);
    const res = await a.post('/api/auth/sign-in').send({ email: viewer.email.toUpperCase(), password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.email).toBe(viewer.email);
    expect(res.body.teams.map((x: { role: string }) => x.role)).toContain('viewer');
    expect((await a.get('/api/auth/me')).status).toBe(200);
    expect((await a.post('/api/auth/sign-out')).status).toBe(204);
    expectProblem(await a.get('/api/auth/me'), 401);
  });

  it('sets the session cookie HttpOnly and SameSite=Lax', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('X-Arcbench-Request', '1').send({ email: viewer.email, password: DEMO_PASSWORD });
    const cookie = sessionCookie(res);
    // OWASP Session Management Cheat Sheet: HttpOnly keeps scripts away from the id; SameSite limits cross-site sends.
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
  });

  // No cookie exists before sign-in (saveUninitialized: false), so fixation is shown the other way round:
  // every sign-in issues a new id, the previous session dies with it, and sign-out kills the id for good.
  it('issues a new session id at every sign-in and invalidates the old one', async () => {
    const first = await signIn();
    const second = await signIn();
    expect(second).not.toBe(first);

    const a = agent(t.app);
    const res1 = await a.post('/api/auth/sign-in').send({ email: viewer.email, password: DEMO_PASSWORD });
    const before = cookieValue(sessionCookie(res1));
    const res2 = await a.post('/api/auth/sign-in').send({ email: viewer.email, password: DEMO_PASSWORD });
    const after = cookieValue(sessionCookie(res2));
    expect(after).not.toBe(before);
    expectProblem(await me(before), 401); // regenerate() destroyed the old session
    expect((await me(after)).status).toBe(200);
  });

  it('a session cookie captured before sign-out is useless afterwards', async () => {
    const cookie = await signIn();
    expect((await me(cookie)).status).toBe(200);
    const out = await request(t.app).post('/api/auth/sign-out').set('X-Arcbench-Request', '1').set('Cookie', cookie);
    expect(out.status).toBe(204);
    expectProblem(await me(cookie), 401);
  });

  it('gives the same answer for an unknown e-mail and a wrong password', async () => {
    const unknown = await agent(t.app).post('/api/auth/sign-in').send({ email: 'nobody-here@ollendry.test', password: 'whatever-password' });
    const wrong = await agent(t.app).post('/api/auth/sign-in').send({ email: viewer.email, password: 'not-the-password' });
    expectProblem(unknown, 401);
    expectProblem(wrong, 401);
    expect(unknown.body.detail).toBe(wrong.body.detail);
    expect(unknown.body.title).toBe(wrong.body.title);
  });

  it('stores argon2id hashes with m=19456, t=2, p=1', async () => {
    const [row] = await t.deps.db.select({ hash: users.passwordHash }).from(users).where(eq(users.email, viewer.email));
    // OWASP Password Storage Cheat Sheet: argon2id, 19 MiB memory, 2 iterations, 1 degree of parallelism.
    // PHC string format (RFC 9106 implementations): $argon2id$v=19$m=…,t=…,p=…$salt$hash
    expect(argon2Params(row.hash)).toEqual({ algorithm: 'argon2id', version: 'v=19', m: 19456, t: 2, p: 1 });
  });
});

describe('sign-in rate limit', () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await createTestApp({ signInLimitPerWindow: 3 });
  });
  afterAll(() => limited.close());

  it('refuses the 4th attempt in the window with 429 problem+json', async () => {
    const attempt = () => agent(limited.app).post('/api/auth/sign-in').send({ email: viewer.email, password: 'wrong-password' });
    for (let i = 0; i < 3; i++) expectProblem(await attempt(), 401);
    const fourth = await attempt();
    expectProblem(fourth, 429);
    expect(fourth.body.detail).toMatch(/too many/i);
    // Even the right password is refused while the window lasts.
    expectProblem(await agent(limited.app).post('/api/auth/sign-in').send({ email: viewer.email, password: DEMO_PASSWORD }), 429);
  });
});
