// Shot results show the latest fit and, beside it, the latest approved fit: after a new run
// awaits review, the approved numbers are still there and the row says which is which.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FitDetail, ShotFits, ShotOverviewRow } from '../../shared/schemas/fits';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

let t: TestApp;
let analyst: Awaited<ReturnType<typeof signInAs>>;
let teamId: string;
const url = (path: string) => `/api/teams/${teamId}${path}`;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  const me = await analyst.get('/api/auth/me');
  teamId = me.body.teams.find((tm: { slug: string }) => tm.slug === DEMO_TEAM.slug).id;
});
afterAll(() => t.close());

describe('shot results', () => {
  it('keep the latest approved fit beside a newer fit awaiting review', async () => {
    const engineer = await signInAs(t.app, demoPerson('engineer').email, DEMO_PASSWORD);
    // A demo shot with a marked projectile track (the seed marks its clips).
    const shots = await analyst.get(url('/shots')).query({ pageSize: 100 });
    let found: { shotId: string; label: string; trackId: string } | null = null;
    for (const shot of shots.body.items as { id: string; label: string }[]) {
      const fits = (await analyst.get(url(`/shots/${shot.id}/fits`))).body as ShotFits;
      const track = fits.tracks.find((tr) => tr.kind === 'projectile' && tr.markCount >= 5);
      // The last such shot: other test files run fits on the first one.
      if (track) found = { shotId: shot.id, label: shot.label, trackId: track.id };
    }
    expect(found, 'the demo seed marks a projectile track').not.toBeNull();
    const { shotId, label, trackId } = found!;

    // The analyst runs a fit, an engineer approves it, then the analyst runs another.
    const first = await analyst.post(url(`/tracks/${trackId}/fits`));
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const approved = first.body as FitDetail;
    const review = await engineer.post(url(`/fits/${approved.id}/review`)).send({ decision: 'approve', note: '' });
    expect(review.status, JSON.stringify(review.body)).toBe(200);
    const second = await analyst.post(url(`/tracks/${trackId}/fits`));
    expect(second.status).toBe(201);
    const latest = second.body as FitDetail;

    const page = await analyst.get(url('/shot-overview')).query({ q: label, pageSize: 100 });
    expect(page.status).toBe(200);
    const row = (page.body.items as ShotOverviewRow[]).find((r) => r.shotId === shotId)!;
    expect(row.fitId).toBe(latest.id);
    expect(row.status).toBe('awaiting-review');
    expect(row.approved).toEqual({ fitId: approved.id, launchSpeedMps: approved.launchSpeedMps, dragCoefficient: approved.dragCoefficient });
  });
});
