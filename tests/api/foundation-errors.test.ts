import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

// RFC 7807 (Problem Details for HTTP APIs): media type application/problem+json,
// members type, title, status, detail.
function expectProblem(res: request.Response, status: number) {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body).toMatchObject({ status, title: expect.any(String), detail: expect.any(String), type: expect.any(String) });
  expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/); // no stack trace
}

describe('API errors are problem+json', () => {
  it('unknown route → 404', async () => {
    expectProblem(await request(t.app).get('/api/no-such-thing'), 404);
  });

  it('malformed JSON → 400', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('X-Arcbench-Request', '1')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.test", ');
    expectProblem(res, 400);
    expect(res.body.detail).toMatch(/not valid JSON/);
  });

  it('oversized JSON → 413', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('X-Arcbench-Request', '1')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(2 * 1024 * 1024) }));
    // RFC 9110 §15.5.14: 413 Content Too Large.
    expectProblem(res, 413);
    expect(res.body.title).toMatch(/too large/i);
  });

  it('invalid body → 400 with field errors', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('X-Arcbench-Request', '1').send({ email: 'not-an-email' });
    expectProblem(res, 400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(expect.arrayContaining(['body.email', 'body.password']));
  });

  it('state change without the CSRF header → 403', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'a@b.test', password: 'x' });
    expectProblem(res, 403);
  });

  it('health reports database and ffmpeg', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.body.database.ok).toBe(true);
    expect(res.body.ffmpeg).toHaveProperty('ok');
  });
});
