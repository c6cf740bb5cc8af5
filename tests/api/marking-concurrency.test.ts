import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { createMarkingClip, demoTeamId } from '../support/marking-clip';
import { createTestApp, signInAs, type TestApp } from '../support/test-app';

// Several people marking one track at once. Each writer is its own signed-in
// session (the demo team has three people who may mark; two of them also
// work from a second browser), so writes really arrive interleaved.

let t: TestApp;
let teamId: string;
type Agent = Awaited<ReturnType<typeof signInAs>>;
let writers: { name: string; agent: Agent }[];

beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 10_000 });
  teamId = await demoTeamId(t);
  const sign = (role: 'admin' | 'analyst' | 'tracker') => signInAs(t.app, demoPerson(role).email, DEMO_PASSWORD);
  writers = [
    { name: 'tracker', agent: await sign('tracker') },
    { name: 'analyst', agent: await sign('analyst') },
    { name: 'admin', agent: await sign('admin') },
    { name: 'tracker, second window', agent: await sign('tracker') },
    { name: 'analyst, second window', agent: await sign('analyst') },
    { name: 'admin, second window', agent: await sign('admin') },
  ];
});
afterAll(() => t.close());

describe('concurrent writers on one track', () => {
  it('every mark on a different frame survives, over several rounds of placing and moving', async () => {
    const clipId = await createMarkingClip(t, writers[1].agent, teamId, { frameCount: 1000 });
    const track = await writers[0].agent.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: 'Shared ball' });
    const marks = `/api/teams/${teamId}/tracks/${track.body.id}/marks`;
    const FRAMES_PER_WRITER = 4;
    const ROUNDS = 4;
    // What each writer last stored on each of its frames.
    const expected = new Map<number, { u: number; revision: number }>();

    for (let round = 0; round < ROUNDS; round++) {
      const requests = writers.flatMap((w, wi) =>
        Array.from({ length: FRAMES_PER_WRITER }, (_, k) => {
          // Interleave frames between writers (w0 gets 0, 6, 12…), and add new frames every round.
          const frames = [wi + writers.length * k, 500 + round * 100 + wi * FRAMES_PER_WRITER + k];
          return frames.map((frame) => {
            const u = 1000 * round + frame + 0.25;
            const previous = expected.get(frame);
            return w.agent
              .put(`${marks}/${frame}`)
              .send({ uPx: u, vPx: wi, snapped: round % 2 === 1, expectedRevision: previous ? previous.revision : null })
              .then((res) => ({ frame, u, res, writer: w.name }));
          });
        }).flat(),
      );
      const results = await Promise.all(requests);
      for (const { frame, u, res, writer } of results) {
        expect(res.status, `${writer} frame ${frame} round ${round}: ${JSON.stringify(res.body)}`).toBe(200);
        expected.set(frame, { u, revision: res.body.mark.revision });
      }
    }

    const reloaded = await writers[2].agent.get(marks);
    expect(reloaded.status).toBe(200);
    const stored = new Map(reloaded.body.marks.map((m: { frameNumber: number; uPx: number; revision: number }) => [m.frameNumber, m]));
    expect(stored.size).toBe(expected.size);
    for (const [frame, want] of expected) {
      expect(stored.get(frame), `frame ${frame}`).toMatchObject({ uPx: want.u, revision: want.revision });
    }
    // Revisions are unique within the track: no two writes got the same token.
    const revisions = reloaded.body.marks.map((m: { revision: number }) => m.revision);
    expect(new Set(revisions).size).toBe(revisions.length);
    // Every successful write bumped the track exactly once.
    const writes = ROUNDS * writers.length * FRAMES_PER_WRITER * 2;
    expect(reloaded.body.trackRevision).toBe(writes);
  });

  it('many writers racing for the same frame: exactly one wins each round, and the stored mark is the winner’s', async () => {
    const clipId = await createMarkingClip(t, writers[1].agent, teamId);
    const track = await writers[0].agent.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: 'Contested ball' });
    const url = `/api/teams/${teamId}/tracks/${track.body.id}/marks/42`;
    let revision: number | null = null;
    for (let round = 0; round < 3; round++) {
      const results = await Promise.all(writers.map((w, wi) => w.agent.put(url).send({ uPx: wi, vPx: round, expectedRevision: revision })));
      const winners = results.filter((r) => r.status === 200);
      expect(winners).toHaveLength(1);
      expect(results.filter((r) => r.status === 409)).toHaveLength(writers.length - 1);
      revision = winners[0].body.mark.revision;
      const stored = (await writers[3].agent.get(`/api/teams/${teamId}/tracks/${track.body.id}/marks`)).body.marks[0];
      expect(stored).toEqual(winners[0].body.mark);
    }
  });
});
