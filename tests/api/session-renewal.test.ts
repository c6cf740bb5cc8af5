// Creating a team changes the creator's roles, and a role change renews the
// session id (server/auth/session-guard.ts; OWASP Session Management Cheat
// Sheet: renew the id on any privilege change). The new id must go out with
// the create answer itself: a browser refetches several views at once right
// after, and if the first of those renewed the id, the others, still carrying
// the old one, would find their session gone and answer 401.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
});
afterAll(() => t.close());

describe('creating a team', () => {
  it('renews the session in its own answer, so parallel requests right after all stay signed in', async () => {
    const person = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
    const created = await person.post('/api/teams').send({ name: `Parallel rig ${uniqueSuffix()}` });
    expect(created.status).toBe(201);
    const after = await Promise.all([person.get('/api/auth/me'), person.get('/api/teams'), person.get(`/api/teams/${created.body.id}`)]);
    expect(after.map((r) => r.status)).toEqual([200, 200, 200]);
    expect((after[0].body.teams as { id: string }[]).some((tm) => tm.id === created.body.id)).toBe(true);
  });
});
