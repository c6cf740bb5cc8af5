import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { SIMPLE_CALIBRATION, createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let tracker: Awaited<ReturnType<typeof signInAs>>;
let analyst: Awaited<ReturnType<typeof signInAs>>;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
  tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
});
afterAll(() => t.close());

async function setUp(opts: Parameters<typeof createMarkingClip>[3] = {}) {
  const clipId = await createMarkingClip(t, analyst, teamId, opts);
  const track = await tracker.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: `CSV ball ${uniqueSuffix()}` });
  return { clipId, marks: `/api/teams/${teamId}/tracks/${track.body.id}/marks` };
}

const PIXELS = 'frame,u_px,v_px\n0,100.000,300.000\n1,120.125,290.500\n2,140.250,282.750\n';

describe('marks CSV', () => {
  it('pixel import → export round trip, and the marks are there on reload', async () => {
    const { marks } = await setUp();
    const imported = await tracker.post(`${marks}/import`).send({ csv: PIXELS, kind: 'pixel' });
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    expect(imported.body.imported).toBe(3);
    const exported = await tracker.get(`${marks}/export?kind=pixel`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toMatch(/^text\/csv/);
    expect(exported.headers['content-disposition']).toMatch(/^attachment; filename="?CSV-ball-\w+-pixel\.csv"?$/);
    expect(exported.text).toBe(PIXELS);
    const reloaded = await tracker.get(marks);
    expect(reloaded.body.marks.map((m: { frameNumber: number; snapped: boolean; placedUPx: number; uPx: number }) => [m.frameNumber, m.uPx, m.placedUPx, m.snapped])).toEqual([
      [0, 100, 100, false],
      [1, 120.125, 120.125, false],
      [2, 140.25, 140.25, false],
    ]);
  });

  it('world import places points through the inverse calibration; world export gives them back', async () => {
    const { clipId, marks } = await setUp({ captureFps: 1000 });
    expectProblem(await tracker.post(`${marks}/import`).send({ csv: 't_s,x_m,y_m\n0,0,0\n', kind: 'world' }), 409);
    await analyst.post(`/api/teams/${teamId}/clips/${clipId}/calibrations`).send(SIMPLE_CALIBRATION);
    const world = 't_s,x_m,y_m\n0.010000000,1.000000,1.000000\n0.011000000,-0.250000,-0.500000\n';
    const res = await tracker.post(`${marks}/import`).send({ csv: world, kind: 'world' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const stored = (await tracker.get(marks)).body.marks;
    // By hand with 200 px/m, origin (100, 300): (1, 1) m → (300, 100) px at frame 10; (−0.25, −0.5) m → (50, 400) px at frame 11.
    expect(stored.map((m: { frameNumber: number }) => m.frameNumber)).toEqual([10, 11]);
    expect(stored[0].uPx).toBeCloseTo(300, 9);
    expect(stored[0].vPx).toBeCloseTo(100, 9);
    expect(stored[1].uPx).toBeCloseTo(50, 9);
    expect(stored[1].vPx).toBeCloseTo(400, 9);
    expect((await tracker.get(`${marks}/export?kind=world`)).text).toBe(world);
  });

  it('a time between frames is refused with its line number', async () => {
    const { clipId, marks } = await setUp({ captureFps: 1000 });
    await analyst.post(`/api/teams/${teamId}/clips/${clipId}/calibrations`).send(SIMPLE_CALIBRATION);
    const res = await tracker.post(`${marks}/import`).send({ csv: 't_s,x_m,y_m\n0.001,0,0\n0.0025,1,1\n', kind: 'world' });
    expectProblem(res, 400);
    expect(res.body.lineErrors).toEqual([{ line: 3, message: expect.stringMatching(/quarter frame/) }]);
  });

  it('a bad file is 400 with line numbers and stores nothing, even with replace', async () => {
    const { marks } = await setUp({ frameCount: 100 });
    await tracker.post(`${marks}/import`).send({ csv: PIXELS, kind: 'pixel' });
    const before = (await tracker.get(marks)).body;
    const bad = 'frame,u_px,v_px\n5,1,1\n6,abc,1\n7,1,1\n';
    const res = await tracker.post(`${marks}/import`).send({ csv: bad, kind: 'pixel', replace: true });
    expectProblem(res, 400);
    expect(res.body.detail).toMatch(/line 3: u_px "abc" is not a number/);
    expect(res.body.lineErrors).toEqual([{ line: 3, message: 'u_px "abc" is not a number' }]);
    const beyond = await tracker.post(`${marks}/import`).send({ csv: 'frame,u_px,v_px\n5,1,1\n150,1,1\n', kind: 'pixel', replace: true });
    expectProblem(beyond, 400);
    expect(beyond.body.lineErrors[0]).toMatchObject({ line: 3 });
    expectProblem(await tracker.post(`${marks}/import`).send({ csv: 't_s,x_m,y_m\n0,1,1\n', kind: 'pixel' }), 400);
    const after = (await tracker.get(marks)).body;
    expect(after).toEqual(before);
  });

  it('replace swaps the whole track; merge keeps frames not in the file', async () => {
    const { marks } = await setUp();
    await tracker.post(`${marks}/import`).send({ csv: PIXELS, kind: 'pixel' });
    await tracker.post(`${marks}/import`).send({ csv: 'frame,u_px,v_px\n2,1,1\n9,2,2\n', kind: 'pixel' });
    expect((await tracker.get(marks)).body.marks.map((m: { frameNumber: number; uPx: number }) => [m.frameNumber, m.uPx])).toEqual([
      [0, 100],
      [1, 120.125],
      [2, 1],
      [9, 2],
    ]);
    await tracker.post(`${marks}/import`).send({ csv: 'frame,u_px,v_px\n4,4,4\n', kind: 'pixel', replace: true });
    expect((await tracker.get(marks)).body.marks.map((m: { frameNumber: number }) => m.frameNumber)).toEqual([4]);
  });
});
