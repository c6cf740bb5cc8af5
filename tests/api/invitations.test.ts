import { createHash } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitations } from '../../server/db/schema/invitations';
import { mailMessages } from '../../server/db/schema/mail-messages';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { argon2Params } from '../support/argon2-params';
import { expectProblem, fieldPaths } from '../support/problem';
import { agent, createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: request.Agent;
let teamId: string;
let teamName: string;
beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  admin = await signInAs(t.app, demoPerson('admin').email, DEMO_PASSWORD);
  // A team of its own, so the demo team keeps its five people.
  teamName = `Invite Trials ${uniqueSuffix()}`;
  const res = await admin.post('/api/teams').send({ name: teamName, siteName: 'Wendlow Flats test field' });
  expect(res.status).toBe(201);
  teamId = res.body.id;
});
afterAll(() => t.close());

const newAddress = (what: string) => `${what}-${uniqueSuffix()}@invitee.test`;

async function invite(email: string, role = 'tracker') {
  const res = await admin.post(`/api/teams/${teamId}/invitations`).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; state: string; email: string; role: string };
}

/** The token as the invitee receives it: from the link in the stored message. */
async function tokenSentTo(email: string): Promise<string> {
  const rows = await t.deps.db.select().from(mailMessages).where(eq(mailMessages.toAddress, email));
  const newest = rows.sort((a, b) => b.receivedAt.getTime() - a.receivedAt.getTime())[0];
  const match = /\/invite\/([A-Za-z0-9_-]+)/.exec(newest.textBody);
  if (!match) throw new Error(`no invitation link in: ${newest.textBody}`);
  return match[1];
}

const anonymous = () => agent(t.app);

describe('invitation flow', () => {
  it('invites, mails the link, previews, and accepts as a new user who is then signed in with the role', async () => {
    const email = newAddress('new');
    const created = await invite(email, 'tracker');
    expect(created).toMatchObject({ email, role: 'tracker', state: 'pending' });
    expect(JSON.stringify(created)).not.toMatch(/token/i);

    // The team outbox (admin) shows the message …
    const outbox = await admin.get(`/api/teams/${teamId}/outbox`).query({ page: 1, pageSize: 5 });
    expect(outbox.status).toBe(200);
    expect(outbox.body.fakeMail).toBe(true);
    expect(outbox.body.total).toBeGreaterThanOrEqual(1);
    const message = outbox.body.items[0];
    expect(message).toMatchObject({ to: email, kind: 'invitation', teamId });
    expect(message.subject).toContain(teamName);
    // … and so does the table the fake SMTP server writes.
    const stored = await t.deps.db.select().from(mailMessages).where(eq(mailMessages.toAddress, email));
    expect(stored).toHaveLength(1);

    const token = await tokenSentTo(email);
    expect(message.text).toContain(`${t.deps.config.publicUrl}/invite/${token}`);
    // 32 random bytes in base64url without padding (RFC 4648 §5) is 43 characters.
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    // Only the SHA-256 of the token is stored (FIPS 180-4 digest, hex).
    const [row] = await t.deps.db.select().from(invitations).where(eq(invitations.id, created.id));
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token);
    const sevenDaysMs = 7 * 24 * 3600 * 1000;
    expect(Math.abs(row.expiresAt.getTime() - row.createdAt.getTime() - sevenDaysMs)).toBeLessThan(60_000);

    const preview = await anonymous().get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ teamName, email, role: 'tracker', state: 'pending', accountExists: false });

    const invitee = anonymous();
    const accepted = await invitee.post(`/api/invitations/${token}/accept`).send({ displayName: 'Rowan Achebe', password: 'a long enough password' });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    expect(accepted.body.teams).toEqual(expect.arrayContaining([expect.objectContaining({ id: teamId, role: 'tracker' })]));

    const me = await invitee.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(email);
    const members = await invitee.get(`/api/teams/${teamId}/members`);
    expect(members.status).toBe(200);
    expect(members.body).toEqual(expect.arrayContaining([expect.objectContaining({ email, displayName: 'Rowan Achebe', role: 'tracker' })]));

    const [account] = await t.deps.db.select().from(users).where(eq(users.email, email));
    // OWASP Password Storage Cheat Sheet argon2id minimum.
    expect(argon2Params(account.passwordHash)).toMatchObject({ algorithm: 'argon2id', m: 19456, t: 2, p: 1 });

    // The invitee reads their own mail; others cannot open it.
    const myMail = await invitee.get('/api/mail');
    expect(myMail.body.items.map((m: { id: string }) => m.id)).toContain(message.id);
    expect((await invitee.get(`/api/mail/${message.id}`)).status).toBe(200);
    expectProblem(await admin.get(`/api/mail/${message.id}`), 404);

    // Single use.
    expect((await anonymous().get(`/api/invitations/${token}`)).body.state).toBe('used');
    const reuse = await anonymous().post(`/api/invitations/${token}/accept`).send({ displayName: 'Someone Else', password: 'another long password' });
    expectProblem(reuse, 410);
    expect(reuse.body.reason).toBe('used');

    const log = await admin.get(`/api/teams/${teamId}/audit`);
    const actions = log.body.items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['team.created', 'invitation.sent', 'invitation.accepted']));
    const acceptance = log.body.items.find((e: { action: string; targetId: string }) => e.action === 'invitation.accepted' && e.targetId === created.id);
    expect(acceptance.actor.displayName).toBe('Rowan Achebe');
  });

  it('refuses an expired link with 410', async () => {
    const email = newAddress('late');
    const { id } = await invite(email);
    const token = await tokenSentTo(email);
    await t.deps.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, id));
    expect((await anonymous().get(`/api/invitations/${token}`)).body.state).toBe('expired');
    const res = await anonymous().post(`/api/invitations/${token}/accept`).send({ displayName: 'Too Late', password: 'a long enough password' });
    expectProblem(res, 410);
    expect(res.body.reason).toBe('expired');
    expect(await t.deps.db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });

  it('refuses a revoked link with 410 and a detail different from a used one', async () => {
    const email = newAddress('revoked');
    const { id } = await invite(email);
    const token = await tokenSentTo(email);
    expect((await admin.delete(`/api/teams/${teamId}/invitations/${id}`)).status).toBe(204);
    expect((await admin.delete(`/api/teams/${teamId}/invitations/${id}`)).status).toBe(204); // twice is harmless
    const res = await anonymous().post(`/api/invitations/${token}/accept`).send({ displayName: 'Not Wanted', password: 'a long enough password' });
    expectProblem(res, 410);
    expect(res.body.reason).toBe('revoked');
    expect(res.body.detail).toMatch(/withdrawn/);
    const log = await admin.get(`/api/teams/${teamId}/audit`).query({ pageSize: 100 });
    expect(log.body.items.filter((e: { action: string; targetId: string }) => e.action === 'invitation.revoked' && e.targetId === id)).toHaveLength(1);
  });

  it('re-inviting a pending address replaces the old invitation', async () => {
    const email = newAddress('twice');
    const first = await invite(email, 'viewer');
    const firstToken = await tokenSentTo(email);
    const second = await invite(email, 'analyst');
    expect(second.id).not.toBe(first.id);
    const list = await admin.get(`/api/teams/${teamId}/invitations`);
    const forAddress = list.body.filter((i: { email: string }) => i.email === email);
    expect(forAddress.filter((i: { state: string }) => i.state === 'pending')).toEqual([expect.objectContaining({ id: second.id, role: 'analyst' })]);
    expect((await anonymous().get(`/api/invitations/${firstToken}`)).body.state).toBe('revoked');
  });

  it('an existing user accepts with their password; a wrong password is 401 and changes nothing', async () => {
    const viewer = demoPerson('viewer'); // in the demo team, not in this one
    await invite(viewer.email, 'engineer');
    const token = await tokenSentTo(viewer.email);
    expect((await anonymous().get(`/api/invitations/${token}`)).body.accountExists).toBe(true);

    const wrong = await anonymous().post(`/api/invitations/${token}/accept`).send({ password: 'definitely not it' });
    expectProblem(wrong, 401);
    const [viewerRow] = await t.deps.db.select({ id: users.id }).from(users).where(eq(users.email, viewer.email));
    const membership = () => t.deps.db.select().from(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, viewerRow.id)));
    expect(await membership()).toHaveLength(0);
    expect((await anonymous().get(`/api/invitations/${token}`)).body.state).toBe('pending');

    const right = anonymous();
    const res = await right.post(`/api/invitations/${token}/accept`).send({ password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(await membership()).toEqual([expect.objectContaining({ role: 'engineer' })]);
    // Their demo-team role is untouched.
    const [demoTeam] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    expect(res.body.teams).toEqual(expect.arrayContaining([expect.objectContaining({ id: demoTeam.id, role: 'viewer' })]));
  });

  it('inviting someone who is already a member → 409', async () => {
    const res = await admin.post(`/api/teams/${teamId}/invitations`).send({ email: demoPerson('admin').email, role: 'viewer' });
    expectProblem(res, 409);
    expect(res.body.detail).toMatch(/already a member/);
  });

  it('a non-admin cannot invite (403), and nothing is sent', async () => {
    const [demoTeam] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const email = newAddress('blocked');
    for (const role of ['analyst', 'tracker', 'engineer', 'viewer'] as const) {
      const a = await signInAs(t.app, demoPerson(role).email, DEMO_PASSWORD);
      expectProblem(await a.post(`/api/teams/${demoTeam.id}/invitations`).send({ email, role: 'viewer' }), 403);
    }
    expect(await t.deps.db.select().from(mailMessages).where(eq(mailMessages.toAddress, email))).toHaveLength(0);
    expect(await t.deps.db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(0);
  });

  it('an unknown token is 404 for preview and accept', async () => {
    const token = 'A'.repeat(43);
    expectProblem(await anonymous().get(`/api/invitations/${token}`), 404);
    expectProblem(await anonymous().post(`/api/invitations/${token}/accept`).send({ displayName: 'X Y', password: 'a long enough password' }), 404);
  });
});

describe('invitation input', () => {
  it('rejects malformed invitation bodies with field errors', async () => {
    const res = await admin.post(`/api/teams/${teamId}/invitations`).send({ email: 'not an address', role: 'chief' });
    expectProblem(res, 400);
    expect(fieldPaths(res)).toEqual(expect.arrayContaining(['body.email', 'body.role']));
  });

  it('a new user must give a display name and a password of 10+ characters', async () => {
    const email = newAddress('form');
    await invite(email);
    const token = await tokenSentTo(email);
    const short = await anonymous().post(`/api/invitations/${token}/accept`).send({ displayName: 'Kim', password: 'short' });
    expectProblem(short, 400);
    expect(fieldPaths(short)).toContain('body.password');
    const nameless = await anonymous().post(`/api/invitations/${token}/accept`).send({ password: 'a long enough password' });
    expectProblem(nameless, 400);
    expect(fieldPaths(nameless)).toContain('body.displayName');
    // Failed attempts leave the link usable.
    expect((await anonymous().get(`/api/invitations/${token}`)).body.state).toBe('pending');
  });
});

describe('outbox with real SMTP configured', () => {
  let real: TestApp;
  beforeAll(async () => {
    real = await createTestApp({ smtpUrl: 'smtp://mail.example.invalid:587' });
  });
  afterAll(() => real.close());

  it('lists nothing and says the mail is not faked', async () => {
    const a = await signInAs(real.app, demoPerson('admin').email, DEMO_PASSWORD);
    const mine = await a.get('/api/mail');
    expect(mine.status).toBe(200);
    expect(mine.body).toMatchObject({ items: [], total: 0, fakeMail: false });
    const out = await a.get(`/api/teams/${teamId}/outbox`);
    expect(out.body).toMatchObject({ items: [], fakeMail: false });
  });
});

describe('accepting is rate-limited like sign-in', () => {
  let limited: TestApp;
  beforeAll(async () => {
    limited = await createTestApp({ signInLimitPerWindow: 2 });
  });
  afterAll(() => limited.close());

  it('refuses the 3rd failed attempt in the window with 429 problem+json', async () => {
    const attempt = () => agent(limited.app).post(`/api/invitations/${'B'.repeat(43)}/accept`).send({ password: 'guessing a password' });
    expectProblem(await attempt(), 404);
    expectProblem(await attempt(), 404);
    expectProblem(await attempt(), 429);
  });
});

describe('when the mail server refuses', () => {
  let broken: TestApp;
  let deadMailer: Mailer;
  beforeAll(async () => {
    // A real SMTP client pointed at a closed loopback port: the connection is refused.
    deadMailer = createMailer('smtp://127.0.0.1:1', 'Arcbench <no-reply@arcbench.invalid>');
    broken = await createTestApp({}, { mailer: deadMailer });
  });
  afterAll(async () => {
    deadMailer.close();
    await broken.close();
  });

  it('reports 502, saves no invitation, and keeps the earlier one valid', async () => {
    const email = newAddress('unsent');
    await invite(email, 'viewer'); // through the working app
    const token = await tokenSentTo(email);
    const a = await signInAs(broken.app, demoPerson('admin').email, DEMO_PASSWORD);
    const res = await a.post(`/api/teams/${teamId}/invitations`).send({ email, role: 'analyst' });
    expectProblem(res, 502);
    expect(res.body.detail).toMatch(/could not be sent/);
    const rows = await t.deps.db.select().from(invitations).where(eq(invitations.email, email));
    expect(rows).toHaveLength(1);
    expect((await anonymous().get(`/api/invitations/${token}`)).body).toMatchObject({ state: 'pending', role: 'viewer' });
  });
});
