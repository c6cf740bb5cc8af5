// The inputs that used to reach PostgreSQL or the fit and come back as 500s
// are now refused at validation with a 400 that names the field.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { demoTeamId } from '../support/clips';
import { expectProblem, fieldPaths } from '../support/problem';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let tracker: Awaited<ReturnType<typeof signInAs>>;
let analyst: Awaited<ReturnType<typeof signInAs>>;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  teamId = await demoTeamId(t.deps.db);
  tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

const markUrl = () => `/api/teams/${teamId}/tracks/${randomUUID()}/marks/12`;

describe('bounded inputs', () => {
  it('refuses a revision above the int4 range (2^31) on mark PUT and DELETE', async () => {
    const put = await tracker.put(markUrl()).send({ uPx: 10, vPx: 10, expectedRevision: 2 ** 31 });
    expectProblem(put, 400);
    expect(fieldPaths(put)).toContain('body.expectedRevision');
    const del = await tracker.delete(`${markUrl()}?expectedRevision=2147483648`);
    expectProblem(del, 400);
    expect(fieldPaths(del)).toContain('query.expectedRevision');
  });

  it('refuses a mark at ±1e308 pixels', async () => {
    const res = await tracker.put(markUrl()).send({ uPx: 1e308, vPx: -1e308 });
    expectProblem(res, 400);
    expect(fieldPaths(res)).toEqual(expect.arrayContaining(['body.uPx', 'body.vPx']));
  });

  it('refuses a NUL character in any text field, naming it', async () => {
    const team = await analyst.post('/api/teams').send({ name: 'Before\u0000after' });
    expectProblem(team, 400);
    expect(fieldPaths(team)).toEqual(['body.name']);
    expect(team.body.detail).toMatch(/NUL/);
    const me = await analyst.patch('/api/auth/me').send({ displayName: 'Tom\u0000' });
    expectProblem(me, 400);
    expect(fieldPaths(me)).toEqual(['body.displayName']);
  });

  it('refuses a scale reference of 1e308 m', async () => {
    const res = await analyst.post(`/api/teams/${teamId}/clips/${randomUUID()}/calibrations`).send({
      scale: { p1: { u: 10, v: 10 }, p2: { u: 200, v: 10 }, lengthM: 1e308 },
      level: { kind: 'angle', rollDeg: 0 },
    });
    expectProblem(res, 400);
    expect(JSON.stringify(res.body.errors)).toMatch(/lengthM/);
  });
});
