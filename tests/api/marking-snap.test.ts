import { Readable } from 'node:stream';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { renderDisc } from '../support/render-disc';
import { createMarkingClip, demoTeamId } from '../support/marking-clip';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

// The snap route on a stored frame image: a disc at a known sub-pixel centre,
// stored as PNG (lossless) through the real storage, decoded by sharp on the server.

let t: TestApp;
let teamId: string;

beforeAll(async () => {
  t = await createTestApp();
  teamId = await demoTeamId(t);
});
afterAll(() => t.close());

describe('POST …/frames/:frameNumber/snap', () => {
  it('refines a click near the disc to its centre; viewers may not', async () => {
    const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
    const tracker = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
    const viewer = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
    const disc = renderDisc({ width: 160, height: 120, centreU: 70.3, centreV: 51.8, radiusPx: 4, background: 200, foreground: 30 });
    const png = await sharp(Buffer.from(disc.data), { raw: { width: disc.width, height: disc.height, channels: 1 } }).png().toBuffer();
    const key = `teams/${teamId}/clips/snap-${uniqueSuffix()}/frames-1/000003.png`;
    await t.deps.storage.put(key, Readable.from(png));
    const clipId = await createMarkingClip(t, analyst, teamId, { frameKeys: new Map([[3, key]]) });
    const url = `/api/teams/${teamId}/clips/${clipId}/frames/3/snap`;

    const res = await tracker.post(url).send({ uPx: 72.5, vPx: 49.5, windowPx: 21 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.snapped.uPx).toBeCloseTo(70.3, 1);
    expect(res.body.snapped.vPx).toBeCloseTo(51.8, 1);
    expect(res.body.snapped.confidence).toBeGreaterThan(0.5);

    const empty = await tracker.post(url).send({ uPx: 140, vPx: 100 });
    expect(empty.body).toEqual({ snapped: null });
    expectProblem(await tracker.post(`/api/teams/${teamId}/clips/${clipId}/frames/4/snap`).send({ uPx: 1, vPx: 1 }), 404);
    expectProblem(await viewer.post(url).send({ uPx: 72.5, vPx: 49.5 }), 403);
    await t.deps.storage.delete(key);
  });
});
