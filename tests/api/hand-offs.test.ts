// The hand-off chain through the API, in a fresh team of five demo people: an
// analyst's first calibration tells the frame marker, "marking done" puts the track
// in the engineers' queue and tells them, a rejection sends the reviewer's note back
// to the people of the clip, the person who ran a fit may not approve it while the
// team's separation-of-duties rule is on, and each person's notification mode
// (none, each event, daily digest) decides what reaches them.
import { and, eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailMessages } from '../../server/db/schema/mail-messages';
import { memberships } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import type { GeneratedClip } from '../../server/fixtures/clip-generator';
import { sendDailyDigests } from '../../server/notifications/send-digests';
import { DEMO_PASSWORD, DEMO_TEAM, demoPeopleOf, demoPerson } from '../../server/seed/demo-people';
import { DEMO_PRESET_NAMES } from '../../server/seed/demo-presets';
import { fits } from '../../server/db/schema/fits';
import { teams } from '../../server/db/schema/teams';
import type { FitDetail } from '../../shared/schemas/fits';
import type { Track } from '../../shared/schemas/marking';
import type { WorkQueueKey, WorkQueues } from '../../shared/schemas/work-queues';
import { calibrateFromTruth, createShotRecords, createTrackWithMarks, generateFitClip, noisyTruthMarks, uploadAndExtract, type RecordsIds } from '../support/fit-scenario';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let clip: GeneratedClip;
let cleanupClip: () => Promise<void>;
let records: RecordsIds;
let clipId: string;
let trackId: string;
const sfx = uniqueSuffix();
const [dev, sana] = demoPeopleOf('engineer');
const as: Record<'maren' | 'tomas' | 'ines' | 'dev' | 'sana', request.Agent> = {} as never;

async function userId(email: string) {
  return (await t.deps.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;
}

async function mailOf(kind: string) {
  return t.deps.db
    .select({ to: mailMessages.toAddress, text: mailMessages.textBody, subject: mailMessages.subject })
    .from(mailMessages)
    .where(and(eq(mailMessages.teamId, teamId), eq(mailMessages.kind, kind)));
}

async function queue(key: WorkQueueKey) {
  const res = await as.maren.get(`/api/teams/${teamId}/work-queues`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const q = (res.body as WorkQueues).queues.find((x) => x.key === key)!;
  return { count: q.count, ids: q.items.map((i) => i.id) };
}

const runFit = async (a: request.Agent) => {
  const res = await a.post(`/api/teams/${teamId}/tracks/${trackId}/fits`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as FitDetail;
};
const review = (a: request.Agent, fitId: string, body: object) => a.post(`/api/teams/${teamId}/fits/${fitId}/review`).send(body);

beforeAll(async () => {
  t = await createTestApp({ jobSchema: `jobs_handoff_${sfx}`, signInLimitPerWindow: 1000 }, {}, { jobs: 'worker' });
  as.maren = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
  const team = await as.maren.post('/api/teams').send({ name: `Hand-offs ${sfx}` });
  expect(team.status).toBe(201);
  teamId = team.body.id;
  for (const [email, role] of [
    [demoPerson('analyst').email, 'analyst'],
    [demoPerson('tracker').email, 'tracker'],
    [dev.email, 'engineer'],
    [sana.email, 'engineer'],
  ] as const) {
    await t.deps.db.insert(memberships).values({ teamId, userId: await userId(email), role });
  }
  as.tomas = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  as.ines = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  as.dev = await signInAs(t.app, dev.email, DEMO_PASSWORD);
  as.sana = await signInAs(t.app, sana.email, DEMO_PASSWORD);
  for (const a of Object.values(as)) expect((await a.patch('/api/auth/me').send({ notificationMode: 'each' })).status).toBe(200);
  ({ clip, cleanup: cleanupClip } = await generateFitClip());
}, 300_000);

afterAll(async () => {
  // The demo people are shared with other files: leave them as the seed made them.
  for (const a of Object.values(as)) await a.patch('/api/auth/me').send({ notificationMode: 'each' });
  await cleanupClip?.();
  await t?.close();
});

describe('the hand-off chain', () => {
  it('an uploaded clip waits for calibration; the first calibration tells the frame marker only', async () => {
    records = await createShotRecords(as.tomas, teamId, clip.truth);
    clipId = await uploadAndExtract(as.tomas, teamId, records.shotId, clip);
    expect((await queue('clips-to-calibrate')).ids).toContain(clipId);

    await calibrateFromTruth(as.tomas, teamId, clipId, clip.truth);
    const mails = await mailOf('clip-ready-to-mark');
    expect(mails.map((m) => m.to)).toEqual([demoPerson('tracker').email]);
    expect(mails[0].text).toContain(`/t/${teamId}/clips/${clipId}/workspace`);
    expect((await queue('clips-to-calibrate')).ids).not.toContain(clipId);
    expect((await queue('clips-to-mark')).ids).toContain(clipId);

    // A second calibration version is not news to the frame marker.
    await calibrateFromTruth(as.tomas, teamId, clipId, clip.truth);
    expect(await mailOf('clip-ready-to-mark')).toHaveLength(1);
  }, 300_000);

  it('a track with too few marks cannot be handed on; a marked one goes to the engineers and they are told', async () => {
    const empty = await as.ines.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: 'Empty', kind: 'projectile' });
    const refused = await as.ines.post(`/api/teams/${teamId}/tracks/${empty.body.id}/marking-done`).send({ done: true });
    expectProblem(refused, 422);
    expect(refused.body.detail).toMatch(/at least 5 frames/);
    await as.ines.delete(`/api/teams/${teamId}/tracks/${empty.body.id}`);

    trackId = await createTrackWithMarks(as.ines, teamId, clipId, noisyTruthMarks(clip.truth, 0.5, 11));
    expect((await queue('clips-to-mark')).ids).not.toContain(clipId);
    const done = await as.ines.post(`/api/teams/${teamId}/tracks/${trackId}/marking-done`).send({ done: true });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect((done.body as Track).markingDone?.by?.displayName).toBe(demoPerson('tracker').displayName);
    expect((await mailOf('track-ready-to-fit')).map((m) => m.to).sort()).toEqual([dev.email, sana.email].sort());
    expect((await queue('tracks-ready-to-fit')).ids).toContain(trackId);

    // Engineers do not mark (CAN.mark), so they cannot hand marking on either.
    expectProblem(await as.dev.post(`/api/teams/${teamId}/tracks/${trackId}/marking-done`).send({ done: false }), 403);
  }, 300_000);

  it('the engineer who ran a fit may not approve it (403 with the reason); a rejection sends the note to the clip’s people', async () => {
    const fit = await runFit(as.dev);
    expect((await queue('tracks-ready-to-fit')).ids).not.toContain(trackId);
    expect((await queue('fits-awaiting-review')).ids).toContain(fit.id);

    const own = await review(as.dev, fit.id, { decision: 'approve' });
    expectProblem(own, 403);
    expect(own.body.detail).toMatch(/separation of duties/);
    expect(own.body.detail).toMatch(/Another engineer or an admin can approve it/);

    const note = 'Marks 40 to 45 sit on the post shadow; re-mark them.';
    expect((await review(as.dev, fit.id, { decision: 'reject', note })).status).toBe(200);
    const mails = await mailOf('fit-rejected');
    expect(mails.map((m) => m.to).sort()).toEqual([demoPerson('analyst').email, demoPerson('tracker').email].sort());
    for (const m of mails) expect(m.text).toContain(note);
  }, 300_000);

  it('another engineer approves; a digest reader gets one digest; someone with no e-mail gets nothing', async () => {
    expect((await as.sana.patch('/api/auth/me').send({ notificationMode: 'digest' })).body.notificationMode).toBe('digest');
    expect((await as.ines.patch('/api/auth/me').send({ notificationMode: 'none' })).status).toBe(200);
    // Catch up on anything queued for digests by other files first, so the counts below are this file's.
    await sendDailyDigests(t.deps);

    const fit = await runFit(as.dev);
    const requests = (await mailOf('fit-awaiting-review')).filter((m) => m.text.includes(fit.id)).map((m) => m.to);
    expect(requests).toEqual([demoPerson('admin').email]);

    const approved = await review(as.sana, fit.id, { decision: 'approve', note: 'Second pair of eyes: fine.' });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body.state).toBe('approved');

    const first = await sendDailyDigests(t.deps);
    expect(first.mails).toBeGreaterThanOrEqual(1);
    const digests = (await mailOf('daily-digest')).filter((m) => m.to === sana.email);
    expect(digests).toHaveLength(1);
    expect(digests[0].text).toContain(fit.id);
    expect((await sendDailyDigests(t.deps)).mails).toBe(0);
    expect((await mailOf('daily-digest')).filter((m) => m.to === sana.email)).toHaveLength(1);

    // Ines chose none: a rejection reaches the analyst who ran the fit, not her.
    const second = await runFit(as.tomas);
    expect((await review(as.dev, second.id, { decision: 'reject', note: 'One more look, please.' })).status).toBe(200);
    const fresh = (await mailOf('fit-rejected')).filter((m) => m.text.includes(second.id));
    expect(fresh.map((m) => m.to)).toEqual([demoPerson('analyst').email]);
  }, 300_000);

  it('only admins change the rule; with it off, the runner may approve', async () => {
    expectProblem(await as.dev.patch(`/api/teams/${teamId}/settings`).send({ separateFitApproval: false }), 403);
    expectProblem(await as.maren.patch(`/api/teams/${teamId}/settings`).send({}), 400);
    const off = await as.maren.patch(`/api/teams/${teamId}/settings`).send({ separateFitApproval: false });
    expect(off.body).toEqual({ separateFitApproval: false });
    expect((await as.ines.get(`/api/teams/${teamId}/settings`)).body).toEqual({ separateFitApproval: false });
    const fit = await runFit(as.dev);
    expect((await review(as.dev, fit.id, { decision: 'approve' })).status).toBe(200);
  }, 300_000);

  it('recent activity names the hand-off with a frame of the clip', async () => {
    const res = await as.ines.get(`/api/teams/${teamId}/work-queues`);
    const entry = (res.body as WorkQueues).activity.find((a) => a.text === 'finished marking a track');
    expect(entry?.actor).toBe(demoPerson('tracker').displayName);
    expect(entry?.thumbnail?.clipId).toBe(clipId);
    const img = await as.ines.get(`/api/teams/${teamId}/clips/${clipId}/thumbnails/${entry!.thumbnail!.n}/image`);
    expect(img.status).toBe(200);
  });

  it('the demo team home charts each approved fit of the preset’s launcher and projectile', async () => {
    const [demo] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const res = await as.ines.get(`/api/teams/${demo.id}/work-queues`);
    expect(res.status).toBe(200);
    const trend = (res.body as WorkQueues).trends.find((p) => p.name === DEMO_PRESET_NAMES.lt40)!;
    expect(trend.points.length).toBeGreaterThan(0);
    for (const p of trend.points) {
      const [fit] = await t.deps.db.select({ cd: fits.dragCoefficient, state: fits.state }).from(fits).where(eq(fits.id, p.fitId));
      expect(fit.state).toBe('approved');
      expect(p.dragCoefficient).toBe(fit.cd);
      // No real launcher beats the model of its ideal gas work (the adiabatic/constant-pressure closed forms), so 0 < η ≤ 1.
      expect(p.launcherEfficiency).toBeGreaterThan(0);
      expect(p.launcherEfficiency).toBeLessThanOrEqual(1);
    }
  });
});
