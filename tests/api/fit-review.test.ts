// Sign-off workflow of a fit: who may review, the states a fit moves through,
// an approved fit staying frozen, staleness after marks or calibration change,
// the notifications (to the right people, never to those who opted out), and
// the shot overview built from the latest fits. Runs in a fresh team so the
// mail and overview counts are this file's alone.
import { and, eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords';
import { auditEvents } from '../../server/db/schema/audit-events';
import { mailMessages } from '../../server/db/schema/mail-messages';
import { memberships } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import type { GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import type { Role } from '../../shared/roles';
import type { FitDetail } from '../../shared/schemas/fits';
import { calibrateFromTruth, createShotRecords, generateFitClip, markedShot, type MarkedShot } from '../support/fit-scenario';
import { expectProblem } from '../support/problem';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let teamId: string;
let clip: GeneratedClip;
let cleanupClip: () => Promise<void>;
let shot: MarkedShot;
const as: Partial<Record<'maren' | 'tomas' | 'dev' | 'ines' | 'lou' | 'quietAnalyst', request.Agent>> = {};
const sfx = uniqueSuffix();
const quietEngineer = `quiet.engineer.${sfx}@ollendry.test`;
const quietAnalyst = `quiet.analyst.${sfx}@ollendry.test`;

async function userId(email: string) {
  return (await t.deps.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;
}

async function addUser(email: string, role: Role, notify: boolean) {
  const [u] = await t.deps.db
    .insert(users)
    .values({ email, displayName: `Quiet ${role}`, passwordHash: await hashPassword(DEMO_PASSWORD), notificationMode: notify ? 'each' : 'none' })
    .returning({ id: users.id });
  await t.deps.db.insert(memberships).values({ teamId, userId: u.id, role });
}

async function mailTo(kind: string) {
  const rows = await t.deps.db
    .select({ to: mailMessages.toAddress, text: mailMessages.textBody, subject: mailMessages.subject })
    .from(mailMessages)
    .where(and(eq(mailMessages.teamId, teamId), eq(mailMessages.kind, kind)));
  return rows;
}

const runFit = async (a: request.Agent, trackId: string) => {
  const res = await a.post(`/api/teams/${teamId}/tracks/${trackId}/fits`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as FitDetail;
};
const review = (a: request.Agent, fitId: string, body: object) => a.post(`/api/teams/${teamId}/fits/${fitId}/review`).send(body);
const getFit = async (fitId: string) => (await as.tomas!.get(`/api/teams/${teamId}/fits/${fitId}`)).body as FitDetail;

beforeAll(async () => {
  t = await createTestApp({ jobSchema: `jobs_review_${sfx}`, signInLimitPerWindow: 1000 }, {}, { jobs: 'worker' });
  as.maren = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
  const team = await as.maren.post('/api/teams').send({ name: `Fit Review ${sfx}` });
  expect(team.status).toBe(201);
  teamId = team.body.id;
  for (const role of ['analyst', 'engineer', 'tracker', 'viewer'] as const) {
    await t.deps.db.insert(memberships).values({ teamId, userId: await userId(demoPerson(role).email), role });
  }
  await addUser(quietEngineer, 'engineer', false);
  await addUser(quietAnalyst, 'analyst', false);
  as.tomas = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
  as.dev = await signInAs(t.app, demoPerson('engineer').email, DEMO_PASSWORD);
  as.ines = await signInAs(t.app, demoPerson('tracker').email, DEMO_PASSWORD);
  as.lou = await signInAs(t.app, demoPerson('viewer').email, DEMO_PASSWORD);
  as.quietAnalyst = await signInAs(t.app, quietAnalyst, DEMO_PASSWORD);
  ({ clip, cleanup: cleanupClip } = await generateFitClip());
  shot = await markedShot(as.tomas, teamId, clip, 9);
}, 300_000);

afterAll(async () => {
  await cleanupClip?.();
  await t?.close();
});

describe('review workflow', () => {
  let approved: FitDetail;

  it('a new fit awaits review and tells the reviewers, not the others or the opted-out', async () => {
    approved = await runFit(as.tomas!, shot.trackId);
    expect(approved.state).toBe('awaiting-review');
    const mails = await mailTo('fit-awaiting-review');
    // CAN.review is admin and engineer; the runner (Tomas) and notification_mode = 'none' users are skipped.
    expect(mails.map((m) => m.to).sort()).toEqual([demoPerson('engineer').email, demoPerson('admin').email].sort());
    expect(mails[0].text).toContain(`${t.deps.config.publicUrl}/t/${teamId}/fits/${approved.id}`);
    expect(mails.map((m) => m.to)).not.toContain(quietEngineer);
  });

  it('only reviewers may review', async () => {
    expectProblem(await review(as.lou!, approved.id, { decision: 'approve' }), 403);
    expectProblem(await review(as.tomas!, approved.id, { decision: 'approve' }), 403);
    expectProblem(await review(as.ines!, approved.id, { decision: 'approve' }), 403);
  });

  it('a rejection needs a note', async () => {
    const res = await review(as.dev!, approved.id, { decision: 'reject', note: '' });
    expectProblem(res, 400);
    expect(JSON.stringify(res.body.errors)).toContain('body.note');
    expect((await getFit(approved.id)).state).toBe('awaiting-review');
  });

  it('approving freezes the fit and tells the analyst who ran it', async () => {
    const res = await review(as.dev!, approved.id, { decision: 'approve', note: 'Residuals flat; matches the previous session.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.state).toBe('approved');
    expect(res.body.reviewedBy.displayName).toBe(demoPerson('engineer').displayName);
    const mails = await mailTo('fit-approved');
    expect(mails.map((m) => m.to)).toEqual([demoPerson('analyst').email]);
    expect(mails[0].text).toContain(`/t/${teamId}/fits/${approved.id}`);
    expect(mails[0].text).toContain('Residuals flat');

    // Frozen: no second decision either way.
    expectProblem(await review(as.dev!, approved.id, { decision: 'approve' }), 409);
    expectProblem(await review(as.maren!, approved.id, { decision: 'reject', note: 'changed my mind' }), 409);
    const audit = await t.deps.db.select({ action: auditEvents.action }).from(auditEvents).where(and(eq(auditEvents.targetType, 'fit'), eq(auditEvents.targetId, approved.id)));
    expect(audit.map((a) => a.action)).toEqual(['fit.run', 'fit.approve']);
    expect((await getFit(approved.id)).audit.map((a) => a.action)).toEqual(['fit.run', 'fit.approve']);
  });

  it('a new calibration makes a waiting fit stale; the approved one stays approved, flagged', async () => {
    const waiting = await runFit(as.tomas!, shot.trackId);
    await calibrateFromTruth(as.tomas!, teamId, shot.clipId, clip.truth);
    const stale = await getFit(waiting.id);
    expect(stale.state).toBe('stale');
    expect(stale.staleness).toMatchObject({ inputsChanged: true, calibrationChanged: true, marksChanged: false, currentCalibrationVersion: 2 });
    expectProblem(await review(as.dev!, waiting.id, { decision: 'approve' }), 409);

    const stillApproved = await getFit(approved.id);
    expect(stillApproved.state).toBe('approved');
    expect(stillApproved.staleness.inputsChanged).toBe(true);
    expect(stillApproved.staleness.message).toMatch(/since review/);
    // The frozen numbers are the ones approved.
    expect(stillApproved.result.launchSpeedMps.value).toBe(approved.result.launchSpeedMps.value);
  });

  it('a changed mark makes a waiting fit stale', async () => {
    const waiting = await runFit(as.tomas!, shot.trackId);
    expect(waiting.calibrationVersion).toBe(2);
    const marks = await as.tomas!.get(`/api/teams/${teamId}/tracks/${shot.trackId}/marks`);
    const m = marks.body.marks[20];
    const moved = await as.tomas!.put(`/api/teams/${teamId}/tracks/${shot.trackId}/marks/${m.frameNumber}`).send({ uPx: m.uPx + 0.3, vPx: m.vPx, expectedRevision: m.revision });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    const stale = await getFit(waiting.id);
    expect(stale.state).toBe('stale');
    expect(stale.staleness).toMatchObject({ marksChanged: true, calibrationChanged: false });
    expectProblem(await review(as.dev!, waiting.id, { decision: 'reject', note: 'too late' }), 409);
  });

  it('a rejection tells the analyst; an analyst who opted out gets nothing', async () => {
    const rejected = await runFit(as.tomas!, shot.trackId);
    const res = await review(as.dev!, rejected.id, { decision: 'reject', note: 'Mark 20 looks off; re-mark and run again.' });
    expect(res.body.state).toBe('rejected');
    expectProblem(await review(as.dev!, rejected.id, { decision: 'approve' }), 409);
    expect((await mailTo('fit-rejected')).map((m) => m.to)).toEqual([demoPerson('analyst').email]);

    const quiet = await runFit(as.quietAnalyst!, shot.trackId);
    expect((await review(as.dev!, quiet.id, { decision: 'approve' })).status).toBe(200);
    const approvals = (await mailTo('fit-approved')).map((m) => m.to);
    expect(approvals).not.toContain(quietAnalyst);
    // The quiet analyst's fit still went to the reviewers who want mail.
    const requests = (await mailTo('fit-awaiting-review')).filter((m) => m.text.includes(quiet.id)).map((m) => m.to).sort();
    expect(requests).toEqual([demoPerson('engineer').email, demoPerson('admin').email].sort());
  });

  it('a viewer reads fits but cannot run them', async () => {
    expect((await as.lou!.get(`/api/teams/${teamId}/fits/${approved.id}`)).status).toBe(200);
    expectProblem(await as.lou!.post(`/api/teams/${teamId}/tracks/${shot.trackId}/fits`), 403);
    expectProblem(await as.ines!.post(`/api/teams/${teamId}/tracks/${shot.trackId}/fits`), 403);
  });
});

describe('shot overview', () => {
  it('lists shots with their latest fit, filtered, sorted and paged on the server', async () => {
    const other = await createShotRecords(as.tomas!, teamId, clip.truth);
    const all = await as.tomas!.get(`/api/teams/${teamId}/shot-overview`);
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(2);
    const fitted = all.body.items.find((r: { shotId: string }) => r.shotId === shot.shotId);
    const list = await as.tomas!.get(`/api/teams/${teamId}/shots/${shot.shotId}/fits`);
    const latest = list.body.fits[0];
    expect(fitted).toMatchObject({ status: latest.state, fitId: latest.id, launchSpeedMps: latest.launchSpeedMps, dragCoefficient: latest.dragCoefficient, fitCount: list.body.fits.length });
    expect(all.body.items.find((r: { shotId: string }) => r.shotId === other.shotId)).toMatchObject({ status: 'no-fit', fitId: null, launchSpeedMps: null });

    const noFit = await as.tomas!.get(`/api/teams/${teamId}/shot-overview?status=no-fit`);
    expect(noFit.body.items.map((r: { shotId: string }) => r.shotId)).toEqual([other.shotId]);
    const approvedOnly = await as.tomas!.get(`/api/teams/${teamId}/shot-overview?status=approved`);
    expect(approvedOnly.body.items.map((r: { shotId: string }) => r.shotId)).toEqual([shot.shotId]);
    // Sorting by speed puts shots without a fit last in either direction.
    for (const dir of ['asc', 'desc']) {
      const sorted = await as.tomas!.get(`/api/teams/${teamId}/shot-overview?sort=speed&dir=${dir}`);
      expect(sorted.body.items.map((r: { shotId: string }) => r.shotId)).toEqual([shot.shotId, other.shotId]);
    }
    const page2 = await as.tomas!.get(`/api/teams/${teamId}/shot-overview?pageSize=1&page=2&sort=label&dir=asc`);
    expect(page2.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(page2.body.items).toHaveLength(1);
    expectProblem(await as.tomas!.get(`/api/teams/${teamId}/shot-overview?sort=nonsense`), 400);
  });
});
