import { eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teams } from '../../server/db/schema/teams';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let maren: request.Agent;
let lou: request.Agent;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  maren = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
  lou = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

describe('teams', () => {
  it('lists my teams with my role and head count', async () => {
    const res = await lou.get('/api/teams');
    expect(res.status).toBe(200);
    const demo = res.body.find((x: { slug: string }) => x.slug === DEMO_TEAM.slug);
    expect(demo).toMatchObject({ name: DEMO_TEAM.name, siteName: DEMO_TEAM.siteName, role: 'viewer' });
    expect(demo.memberCount).toBeGreaterThanOrEqual(5);
  });

  it('creates a team with its creator as admin and a unique slug from the name', async () => {
    const name = `Ridge Test Cell ${uniqueSuffix()}`;
    const first = await lou.post('/api/teams').send({ name, siteName: 'North bay' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ name, siteName: 'North bay', role: 'admin', memberCount: 1 });
    expect(first.body.slug).toBe(name.toLowerCase().replace(/ /g, '-'));
    const second = await maren.post('/api/teams').send({ name });
    expect(second.status).toBe(201);
    expect(second.body.slug).toBe(`${first.body.slug}-2`);

    const shown = await lou.get(`/api/teams/${first.body.id}`);
    expect(shown.body).toMatchObject({ id: first.body.id, role: 'admin', memberCount: 1 });
    expectProblem(await maren.get(`/api/teams/${first.body.id}`), 403); // not a member of Lou's team
    const log = await lou.get(`/api/teams/${first.body.id}/audit`);
    expect(log.body).toMatchObject({ total: 1, page: 1, pageSize: 20 });
    expect(log.body.items[0]).toMatchObject({ action: 'team.created', actor: { displayName: 'Lou Brandt' }, detail: { slug: first.body.slug } });
  });

  it('makes a slug from accented and symbol-only names', async () => {
    const suffix = uniqueSuffix();
    const accented = await maren.post('/api/teams').send({ name: `Équipe Sète ${suffix}` });
    expect(accented.body.slug).toBe(`equipe-sete-${suffix}`);
    const symbols = await maren.post('/api/teams').send({ name: '★★' });
    expect(symbols.status).toBe(201);
    expect(symbols.body.slug).toMatch(/^team(-\d+)?$/);
  });

  it('an unknown or malformed team id is refused without revealing anything', async () => {
    expectProblem(await maren.get('/api/teams/00000000-0000-4000-8000-000000000000'), 403);
    expectProblem(await maren.get('/api/teams/not-an-id'), 404);
  });

  it('rejects malformed team bodies with field errors, and stores nothing', async () => {
    const res = await maren.post('/api/teams').send({ name: 7, siteName: ['x'] });
    expectProblem(res, 400);
    expect(fieldPaths(res)).toEqual(expect.arrayContaining(['body.name', 'body.siteName']));
    const short = await maren.post('/api/teams').send({ name: ' x ' });
    expectProblem(short, 400);
    expect(short.body.detail).toMatch(/at least 2 characters/);
    expect(await t.deps.db.select().from(teams).where(eq(teams.name, 'x'))).toHaveLength(0);
  });
});

describe('paging', () => {
  it('outbox, my mail and the audit log validate page and pageSize', async () => {
    const [demo] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const zero = await maren.get(`/api/teams/${demo.id}/outbox`).query({ page: 0 });
    expectProblem(zero, 400);
    expect(fieldPaths(zero)).toContain('query.page');
    const huge = await maren.get('/api/mail').query({ pageSize: 500 });
    expectProblem(huge, 400);
    expect(fieldPaths(huge)).toContain('query.pageSize');
    const word = await maren.get(`/api/teams/${demo.id}/audit`).query({ page: 'two' });
    expectProblem(word, 400);
    expect(fieldPaths(word)).toContain('query.page');
  });

  it('pages the audit log with a stable total', async () => {
    const created = await maren.post('/api/teams').send({ name: `Paging ${uniqueSuffix()}` });
    const teamId = created.body.id;
    for (const email of ['p1', 'p2', 'p3'].map((p) => `${p}-${uniqueSuffix()}@paging.test`)) {
      expect((await maren.post(`/api/teams/${teamId}/invitations`).send({ email, role: 'viewer' })).status).toBe(201);
    }
    const page1 = await maren.get(`/api/teams/${teamId}/audit`).query({ page: 1, pageSize: 3 });
    const page2 = await maren.get(`/api/teams/${teamId}/audit`).query({ page: 2, pageSize: 3 });
    expect(page1.body.total).toBe(4);
    expect(page1.body.items).toHaveLength(3);
    expect(page2.body.items).toHaveLength(1);
    expect(page2.body.items[0].action).toBe('team.created');
    const outbox = await maren.get(`/api/teams/${teamId}/outbox`).query({ page: 2, pageSize: 2 });
    expect(outbox.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(outbox.body.items).toHaveLength(1);
  });
});
