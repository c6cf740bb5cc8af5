import { and, eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let maren: request.Agent; // demo admin, creator (admin) of each fresh team here
let tomas: request.Agent; // demo analyst, made a member of fresh teams directly in the database
let marenId: string;
let tomasId: string;
let inesId: string;

beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  maren = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
  tomas = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  const idOf = async (email: string) => (await t.deps.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;
  marenId = await idOf(demoPerson('admin').email);
  tomasId = await idOf(demoPerson('analyst').email);
  inesId = await idOf(demoPerson('tracker').email);
});
afterAll(() => t.close());

/** A fresh team through the API (the demo team stays untouched), optionally with more members. */
async function freshTeam(extra: { userId: string; role: 'admin' | 'analyst' | 'tracker' | 'engineer' | 'viewer' }[] = []) {
  const res = await maren.post('/api/teams').send({ name: `Admin Guard ${uniqueSuffix()}` });
  expect(res.status).toBe(201);
  const teamId: string = res.body.id;
  if (extra.length) await t.deps.db.insert(memberships).values(extra.map((m) => ({ teamId, ...m })));
  return teamId;
}

async function adminsOf(teamId: string) {
  const rows = await t.deps.db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'admin')));
  return rows.map((r) => r.userId);
}

const setRole = (a: request.Agent, teamId: string, userId: string, role: string) => a.patch(`/api/teams/${teamId}/members/${userId}`).send({ role });

describe('members', () => {
  it('lists members with roles, admins first', async () => {
    const teamId = await freshTeam([{ userId: inesId, role: 'tracker' }]);
    const res = await maren.get(`/api/teams/${teamId}/members`);
    expect(res.status).toBe(200);
    expect(res.body.map((m: { userId: string; role: string }) => [m.userId, m.role])).toEqual([
      [marenId, 'admin'],
      [inesId, 'tracker'],
    ]);
  });

  it('changes a role and removes a member, with audit entries', async () => {
    const teamId = await freshTeam([{ userId: inesId, role: 'tracker' }]);
    const changed = await setRole(maren, teamId, inesId, 'engineer');
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ userId: inesId, role: 'engineer' });
    expect((await maren.delete(`/api/teams/${teamId}/members/${inesId}`)).status).toBe(204);
    expect((await maren.get(`/api/teams/${teamId}/members`)).body).toHaveLength(1);

    const log = await maren.get(`/api/teams/${teamId}/audit`);
    expect(log.status).toBe(200);
    const byAction = Object.fromEntries(log.body.items.map((e: { action: string }) => [e.action, e]));
    expect(byAction['member.role-changed']).toMatchObject({ targetId: inesId, detail: { from: 'tracker', to: 'engineer' }, actor: { id: marenId, displayName: 'Maren Holt' } });
    expect(byAction['member.removed']).toMatchObject({ targetId: inesId, detail: { role: 'engineer' } });
    expect(byAction['team.created']).toBeDefined();
    // Newest first.
    expect(log.body.items[0].action).toBe('member.removed');
  });

  it('only admins manage members', async () => {
    const teamId = await freshTeam([{ userId: tomasId, role: 'analyst' }, { userId: inesId, role: 'tracker' }]);
    expectProblem(await setRole(tomas, teamId, inesId, 'viewer'), 403);
    expectProblem(await tomas.delete(`/api/teams/${teamId}/members/${inesId}`), 403);
    expect((await tomas.get(`/api/teams/${teamId}/members`)).status).toBe(200); // reading is for everyone
  });

  it('a non-member id is 404, malformed input is 400 with field errors', async () => {
    const teamId = await freshTeam();
    expectProblem(await setRole(maren, teamId, inesId, 'viewer'), 404);
    const badRole = await setRole(maren, teamId, inesId, 'chief');
    expectProblem(badRole, 400);
    expect(fieldPaths(badRole)).toContain('body.role');
    const badId = await setRole(maren, teamId, 'not-a-uuid', 'viewer');
    expectProblem(badId, 400);
    expect(fieldPaths(badId)).toContain('params.userId');
  });
});

describe('the last admin', () => {
  it('cannot be demoted or removed (409), and stays admin', async () => {
    const teamId = await freshTeam([{ userId: inesId, role: 'tracker' }]);
    const demote = await setRole(maren, teamId, marenId, 'viewer');
    expectProblem(demote, 409);
    expect(demote.body.detail).toMatch(/last admin/);
    expect(demote.body.reason).toBe('last-admin');
    const remove = await maren.delete(`/api/teams/${teamId}/members/${marenId}`);
    expectProblem(remove, 409);
    expect(remove.body.detail).toMatch(/last admin/);
    expect(await adminsOf(teamId)).toEqual([marenId]);
  });

  it('one of two admins may step down; then the other is the last', async () => {
    const teamId = await freshTeam([{ userId: tomasId, role: 'admin' }]);
    expect((await setRole(maren, teamId, marenId, 'engineer')).status).toBe(200);
    expectProblem(await setRole(tomas, teamId, tomasId, 'viewer'), 409);
    expect(await adminsOf(teamId)).toEqual([tomasId]);
  });

  it('a demotion waiting on the admin rows sees the one committed before it and refuses', async () => {
    const teamId = await freshTeam([{ userId: tomasId, role: 'admin' }]);
    // Another transaction demotes Tomas and holds the admin rows, as a concurrent request would.
    const other = await t.deps.pool.connect();
    try {
      await other.query('begin');
      const { rows } = await other.query<{ pid: number }>('select pg_backend_pid() as pid');
      await other.query(`select user_id from memberships where team_id = $1 and role = 'admin' order by user_id for update`, [teamId]);
      await other.query(`update memberships set role = 'viewer' where team_id = $1 and user_id = $2`, [teamId, tomasId]);

      const response = setRole(maren, teamId, marenId, 'viewer').then((r) => r);
      // Wait (by polling the server's own lock view, not a clock) until the request is blocked on our lock.
      for (;;) {
        const blocked = await t.deps.pool.query('select count(*)::int as n from pg_stat_activity where $1 = any(pg_blocking_pids(pid))', [rows[0].pid]);
        if (blocked.rows[0].n > 0) break;
        await new Promise((r) => setTimeout(r, 20));
      }
      await other.query('commit');
      const res = await response;
      expectProblem(res, 409);
    } finally {
      other.release();
    }
    expect(await adminsOf(teamId)).toEqual([marenId]);
  });

  it('two admins demoting each other at once leave exactly one admin', async () => {
    for (let round = 0; round < 5; round++) {
      const teamId = await freshTeam([{ userId: tomasId, role: 'admin' }]);
      const results = await Promise.all([setRole(maren, teamId, tomasId, 'viewer'), setRole(tomas, teamId, marenId, 'viewer')]);
      const statuses = results.map((r) => r.status).sort();
      // One wins; the other either waited for the lock and met the last-admin rule (409),
      // or arrived after it had lost its own admin role (403).
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      expect([403, 409]).toContain(statuses[1]);
      expect(await adminsOf(teamId)).toHaveLength(1);
    }
  });
});
