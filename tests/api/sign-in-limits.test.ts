// Sign-in limits a team can live with (default settings unless stated):
// a whole team behind one office address gets in, ten wrong passwords lock
// that one account only, and a forged X-Forwarded-For changes nothing.
import { inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { expectProblem } from '../support/problem';
import { agent, createTestApp, uniqueSuffix, type TestApp } from '../support/test-app';

const suffix = uniqueSuffix();
const PASSWORD = 'office-team-password-1';
let t: TestApp;
const people: string[] = Array.from({ length: 20 }, (_, i) => `person${i}.${suffix}@office.test`);
let teamId: string;

beforeAll(async () => {
  // The defaults of server/config.ts, whatever the environment says.
  t = await createTestApp({ signInLimitPerWindow: 100, signInAccountLimit: 10, trustProxy: false });
  const passwordHash = await hashPassword(PASSWORD);
  const inserted = await t.deps.db
    .insert(users)
    .values(people.map((email, i) => ({ email, displayName: `Person ${i}`, passwordHash })))
    .returning({ id: users.id });
  const [team] = await t.deps.db.insert(teams).values({ name: `One Office ${suffix}`, slug: `one-office-${suffix}` }).returning({ id: teams.id });
  teamId = team.id;
  await t.deps.db.insert(memberships).values(inserted.map((u, i) => ({ teamId, userId: u.id, role: i === 0 ? ('admin' as const) : ('tracker' as const) })));
}, 120_000);

afterAll(async () => {
  await t.deps.db.delete(teams).where(inArray(teams.id, [teamId]));
  await t.deps.db.delete(users).where(inArray(users.email, people));
  await t.close();
});

const signIn = (email: string, password: string, forwardedFor?: string) => {
  const req = agent(t.app).post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password });
};

describe('sign-in limits', () => {
  it('lets 20 people of one team in from one address, each after a typo', async () => {
    for (const email of people) {
      expectProblem(await signIn(email, 'typo-password'), 401);
      const res = await signIn(email, PASSWORD);
      expect(res.status, `${email}: ${JSON.stringify(res.body)}`).toBe(200);
      expect(res.body.teams.map((team: { id: string }) => team.id)).toContain(teamId);
    }
  }, 120_000);

  it('locks an account after 10 wrong passwords, and only that account', async () => {
    const victim = people[3];
    for (let i = 0; i < 10; i++) expectProblem(await signIn(victim, `wrong-${i}-password`), 401);
    const locked = await signIn(victim, PASSWORD);
    expectProblem(locked, 429);
    expect(locked.body.title).toBe('Account locked');
    expect(locked.body.detail).toMatch(/locked after 10 failed sign-ins.*unlocks by itself/);
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(0);
    // Everyone else, from the same address, still gets in.
    expect((await signIn(people[4], PASSWORD)).status).toBe(200);
    expect((await signIn(people[5], PASSWORD)).status).toBe(200);
  }, 120_000);

  it('ignores a forged X-Forwarded-For: it neither escapes a lock nor changes the address', async () => {
    const victim = people[3]; // locked by the previous test
    const forged = await signIn(victim, PASSWORD, '203.0.113.77');
    expectProblem(forged, 429);

    const strict = await createTestApp({ signInLimitPerWindow: 3, signInAccountLimit: 100, trustProxy: false });
    try {
      const attempt = (i: number) =>
        agent(strict.app).post('/api/auth/sign-in').set('X-Forwarded-For', `198.51.100.${i}`).send({ email: people[10 + i], password: 'wrong-password-x' });
      for (let i = 0; i < 3; i++) expectProblem(await attempt(i), 401);
      const fourth = await attempt(3);
      expectProblem(fourth, 429);
      expect(fourth.body.title).toBe('Too many sign-in attempts');
    } finally {
      await strict.close();
    }
  }, 120_000);
});
