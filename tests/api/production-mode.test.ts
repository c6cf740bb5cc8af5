// Production mode (NODE_ENV=production or ARCBENCH_DEMO=off) on a database of
// its own: no demo team is seeded, `npm run admin:create` makes the first admin,
// HSTS is sent, SESSION_SECRET is required, sessions end after their absolute
// lifetime, and a role change issues a new session id.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { count, eq } from 'drizzle-orm';
import pg from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { expectProblem } from '../support/problem';
import { agent, createTestApp, uniqueSuffix, type TestApp } from '../support/test-app';

const root = path.resolve(import.meta.dirname, '../..');
const suffix = uniqueSuffix();
const dbName = `arcbench_prod_${suffix}`;
const prodUrl = (() => {
  const u = new URL(process.env.DATABASE_URL!);
  u.pathname = `/${dbName}`;
  return u.toString();
})();
const SECRET = 'a-production-session-secret-of-forty-chars';
const ADMIN = { email: `first.admin.${suffix}@range.test`, name: 'First Admin', team: `Range Crew ${suffix}`, password: 'long-enough-password-9' };
let t: TestApp;

function runCli(args: string[], input: string, env: NodeJS.ProcessEnv) {
  return spawnSync('npm', ['run', '--silent', ...args], { cwd: root, input, encoding: 'utf8', env: { ...process.env, ...env }, timeout: 120_000 });
}

beforeAll(async () => {
  const migrate = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['server/cli/seed.ts'], {
    cwd: root,
    encoding: 'utf8',
    env: { ...process.env, DATABASE_URL: prodUrl, ARCBENCH_DEMO: 'off', SESSION_SECRET: SECRET },
    timeout: 120_000,
  });
  expect(migrate.status, migrate.stderr + migrate.stdout).toBe(0);
  expect(migrate.stdout).toMatch(/Production mode: no demo team/);
}, 180_000);

afterAll(async () => {
  await t?.close();
  const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await admin.connect();
  await admin.query(`drop database if exists "${dbName}" with (force)`);
  await admin.end();
});

describe('production mode', () => {
  it('requires SESSION_SECRET', () => {
    expect(() => loadConfig({ DATABASE_URL: prodUrl, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(() => loadConfig({ DATABASE_URL: prodUrl, ARCBENCH_DEMO: 'off' })).toThrow(/SESSION_SECRET/);
    const config = loadConfig({ DATABASE_URL: prodUrl, NODE_ENV: 'production', SESSION_SECRET: SECRET });
    expect({ production: config.production, demo: config.demo, absoluteH: config.sessionAbsoluteMs / 3_600_000 }).toEqual({ production: true, demo: false, absoluteH: 12 });
  });

  it('seeds no demo team and no demo users', async () => {
    const check = new pg.Client({ connectionString: prodUrl });
    await check.connect();
    try {
      const { rows } = await check.query<{ users: number; teams: number }>('select (select count(*)::int from users) as users, (select count(*)::int from teams) as teams');
      expect(rows[0]).toEqual({ users: 0, teams: 0 });
    } finally {
      await check.end();
    }
  });

  it('creates the first admin with npm run admin:create (flags, password on stdin)', async () => {
    const made = runCli(['admin:create', '--', '--email', ADMIN.email, '--name', ADMIN.name, '--team', ADMIN.team, '--password-stdin'], `${ADMIN.password}\n`, {
      DATABASE_URL: prodUrl,
      NODE_ENV: 'production',
      SESSION_SECRET: SECRET,
    });
    expect(made.status, made.stderr + made.stdout).toBe(0);
    expect(made.stdout).toContain(`Created ${ADMIN.email} as admin`);
    // A second run with the same e-mail changes nothing and says why.
    const again = runCli(['admin:create', '--', '--email', ADMIN.email, '--name', 'X', '--team', 'Y', '--password-stdin'], `${ADMIN.password}\n`, {
      DATABASE_URL: prodUrl,
      NODE_ENV: 'production',
      SESSION_SECRET: SECRET,
    });
    expect(again.status).toBe(1);
    expect(again.stderr).toMatch(/exists already; nothing was created/);

    t = await createTestApp({ ...loadConfig({ ...process.env, DATABASE_URL: prodUrl, NODE_ENV: 'production', SESSION_SECRET: SECRET }), clientDist: '/nonexistent' });
    const [{ n }] = await t.deps.db.select({ n: count() }).from(users);
    expect(n).toBe(1);
    const admin = agent(t.app);
    const res = await admin.post('/api/auth/sign-in').send({ email: ADMIN.email, password: ADMIN.password });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.teams).toEqual([expect.objectContaining({ name: ADMIN.team, role: 'admin' })]);
    // HSTS (RFC 6797) on every answer in production.
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expectProblem(await agent(t.app).post('/api/auth/sign-in').send({ email: demoPerson('admin').email, password: DEMO_PASSWORD }), 401);
  }, 180_000);

  it('issues a new session id when the user\'s roles change, and the old id stops working', async () => {
    const admin = agent(t.app);
    const signIn = await admin.post('/api/auth/sign-in').send({ email: ADMIN.email, password: ADMIN.password });
    const oldCookie = String(signIn.headers['set-cookie']).split(';')[0];
    expect((await admin.get('/api/auth/me')).status).toBe(200);

    const [user] = await t.deps.db.select({ id: users.id }).from(users).where(eq(users.email, ADMIN.email));
    const [team] = await t.deps.db.insert(teams).values({ name: `Second ${suffix}`, slug: `second-${suffix}` }).returning({ id: teams.id });
    await t.deps.db.insert(memberships).values({ teamId: team.id, userId: user.id, role: 'viewer' });

    const after = await admin.get('/api/auth/me');
    expect(after.status).toBe(200);
    const newCookie = String(after.headers['set-cookie'] ?? '').split(';')[0];
    expect(newCookie).toMatch(/^arcbench\.sid=/);
    expect(newCookie).not.toBe(oldCookie);
    expectProblem(await request(t.app).get('/api/auth/me').set('Cookie', oldCookie), 401);
  }, 60_000);

  it('ends a session after its absolute lifetime even while it is in use', async () => {
    const short = await createTestApp({ ...t.deps.config, sessionAbsoluteMs: 3000 });
    try {
      const a = agent(short.app);
      expect((await a.post('/api/auth/sign-in').send({ email: ADMIN.email, password: ADMIN.password })).status).toBe(200);
      expect((await a.get('/api/auth/me')).status).toBe(200);
      await new Promise((r) => setTimeout(r, 3500));
      expectProblem(await a.get('/api/auth/me'), 401);
    } finally {
      await short.close();
    }
  }, 60_000);
});
