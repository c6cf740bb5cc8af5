import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let teamId: string;
const suffix = uniqueSuffix();
const url = (path: string) => `/api/teams/${teamId}${path}`;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  const me = await analyst.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;
});
afterAll(() => t.close());

describe('series list', () => {
  it('counts the shots of each series, in the list and in one series', async () => {
    const two = (await analyst.post(url('/series')).send({ name: `Two shots ${suffix}`, testDate: '2026-04-18' })).body.id;
    const one = (await analyst.post(url('/series')).send({ name: `One shot ${suffix}`, testDate: '2026-04-19' })).body.id;
    for (const [seriesId, label] of [[two, 'A1'], [two, 'A2'], [one, 'B1']]) {
      expect((await analyst.post(url('/shots')).send({ seriesId, label })).status).toBe(201);
    }
    const listed = await analyst.get(url('/series')).query({ q: suffix });
    const counts = Object.fromEntries(listed.body.map((s: { id: string; shotCount: number }) => [s.id, s.shotCount]));
    expect(counts).toEqual({ [two]: 2, [one]: 1 });
    expect((await analyst.get(url(`/series/${two}`))).body.shotCount).toBe(2);
  });
});
