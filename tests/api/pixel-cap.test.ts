// A small file that would decode to more pixels than the cap allows is refused
// at upload, before the clip is recorded or any frame is written; a range that
// fits is accepted. The team quota refuses an upload that would overfill it.
// The numbers come back in the problem document.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { expectProblem } from '../support/problem';
import { createShot, demoTeamId, filesUnder, fixtureDir, tempStorageDir } from '../support/clips';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const suffix = uniqueSuffix();
// 60 frames of 640×360 = 13 824 000 pixels; the cap lets 30 frames (6 912 000) through.
const CAP = 30 * 640 * 360;
let t: TestApp;
let storageDir: string;
let clip: GeneratedClip;
let teamId: string;
let shotId: string;

beforeAll(async () => {
  storageDir = tempStorageDir('pixcap');
  t = await createTestApp({ storageDir, maxDecodedPixels: CAP, jobSchema: `pgboss_pixcap_${suffix}`, signInLimitPerWindow: 1000 });
  clip = await generatePreset('clean', fixtureDir('pixcap'), { name: 'cap-shot' });
  teamId = await demoTeamId(t.deps.db);
  shotId = await createShot(t.deps.db, teamId, suffix);
}, 180_000);
afterAll(() => t.close());

const upload = async (fields: Record<string, string>, app = t) => {
  const analyst = await signInAs(app.app, demoPerson('analyst').email, DEMO_PASSWORD);
  let req = analyst.post(`/api/teams/${teamId}/shots/${shotId}/clips`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', clip.videoPath);
};
const clipFiles = (dir: string) => filesUnder(dir).filter((f) => f.includes('/clips/'));

describe('decoded-pixel cap', () => {
  it('refuses a clip that would decode to more pixels than the cap, before anything is kept', async () => {
    expect(clip.truth.frameCount * 640 * 360).toBeGreaterThan(CAP);
    const res = await upload({ captureFps: '240' });
    expectProblem(res, 422);
    expect(res.body.title).toBe('Too many pixels to extract');
    expect(res.body).toMatchObject({ decodedPixels: 13_824_000, maxDecodedPixels: CAP, frames: 60, width: 640, height: 360, maxFrames: 30 });
    expect(res.body.detail).toContain('13,824,000 pixels');
    // Nothing was kept: no original, no frames, no scratch.
    await new Promise((r) => setTimeout(r, 300)); // the original is deleted as the response ends
    expect(clipFiles(storageDir)).toEqual([]);
    expect(filesUnder(storageDir).filter((f) => f.startsWith('tmp/'))).toEqual([]);
  });

  it('accepts the same file with a range inside the cap', async () => {
    const res = await upload({ captureFps: '240', inFrame: '10', outFrame: '39' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Widening the range past the cap is refused too, and the clip keeps its range.
    const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
    const wider = await analyst.patch(`/api/teams/${teamId}/clips/${res.body.id}`).send({ inFrame: 0, outFrame: 59 });
    expectProblem(wider, 422);
    const after = await analyst.get(`/api/teams/${teamId}/clips/${res.body.id}`);
    expect([after.body.inFrame, after.body.outFrame]).toEqual([10, 39]);
  });
});

describe('team storage quota', () => {
  it('refuses an upload that would take the team over its quota, saying the numbers', async () => {
    const quotaDir = tempStorageDir('quota');
    const small = await createTestApp({ storageDir: quotaDir, teamStorageQuotaBytes: 1000, jobSchema: `pgboss_quota_${suffix}`, signInLimitPerWindow: 1000 });
    try {
      const res = await upload({ captureFps: '240' }, small);
      expectProblem(res, 413);
      expect(res.body.title).toBe('Team storage full');
      expect(res.body.quotaBytes).toBe(1000);
      expect(res.body.detail).toMatch(/quota of 1000 bytes/);
      await new Promise((r) => setTimeout(r, 300));
      expect(clipFiles(quotaDir)).toEqual([]);
    } finally {
      await small.close();
    }
  });
});
