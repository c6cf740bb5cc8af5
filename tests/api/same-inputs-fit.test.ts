// A fit run again on identical inputs says which earlier fit it repeats (same input hash,
// server/fits/input-hash.ts) and links it, instead of running silently.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FitDetail, ShotFits } from '../../shared/schemas/fits';
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

/** A demo shot with a projectile and a marked projectile track (the seed marks its clips).
 *  Other suites add shots without a projectile to the same team, so the projectile is checked too. */
async function markedTrack(): Promise<{ shotId: string; trackId: string }> {
  const shots = await analyst.get(url('/shots')).query({ pageSize: 100 });
  for (const shot of shots.body.items as { id: string; projectileId: string | null }[]) {
    if (!shot.projectileId) continue;
    const fits = (await analyst.get(url(`/shots/${shot.id}/fits`))).body as ShotFits;
    const track = fits.tracks.find((tr) => tr.kind === 'projectile' && tr.markCount >= 5);
    if (track) return { shotId: shot.id, trackId: track.id };
  }
  throw new Error('the demo seed has no marked projectile track');
}

describe('a fit on identical inputs', () => {
  it('names and links the earlier fit it repeats, numbered as in the shot’s list', async () => {
    const { shotId, trackId } = await markedTrack();
    const first = await analyst.post(url(`/tracks/${trackId}/fits`));
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const second = await analyst.post(url(`/tracks/${trackId}/fits`));
    expect(second.status).toBe(201);
    const a = first.body as FitDetail;
    const b = second.body as FitDetail;
    expect(b.inputHash).toBe(a.inputHash);
    expect(b.sameInputsAs).not.toBeNull();

    // It points at the earliest fit of this shot with the same inputs: the first run, or an older one of the same hash.
    const earlier = (await analyst.get(url(`/fits/${b.sameInputsAs!.id}`))).body as FitDetail;
    expect(earlier.inputHash).toBe(b.inputHash);
    expect(earlier.shotId).toBe(shotId);
    expect(earlier.sameInputsAs).toBeNull();
    expect(a.sameInputsAs?.id ?? a.id).toBe(earlier.id);

    // "Fit N": N counts the shot's fits in the order they ran.
    const list = ((await analyst.get(url(`/shots/${shotId}/fits`))).body as ShotFits).fits;
    const inRunOrder = [...list].sort((x, y) => x.createdAt.localeCompare(y.createdAt)).map((f) => f.id);
    expect(inRunOrder.indexOf(earlier.id) + 1).toBe(b.sameInputsAs!.number);
  });
});
