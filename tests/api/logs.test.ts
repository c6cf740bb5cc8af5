// Structured logs: every line is one JSON object (pino's format) and every line
// about a request carries the same request id as the X-Request-Id header and, for a
// problem, the requestId of the problem+json body (RFC 7807 allows extension members, §3.2).
import { Writable } from 'node:stream';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { agent, createTestApp, type TestApp } from '../support/test-app';

const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(...chunk.toString().split('\n').filter(Boolean));
    done();
  },
});

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({}, { logger: pino({ level: 'info' }, sink) });
});
afterAll(() => t.close());

const parsed = () => lines.map((l) => JSON.parse(l) as { requestId?: string; req?: { path?: string }; res?: { statusCode?: number }; msg?: string });

describe('request logs', () => {
  it('logs each answered request as JSON with its request id, the path without its query, and no headers', async () => {
    const a = agent(t.app);
    const ok = await a.get('/api/health?secret-search=abc');
    const missing = await a.get('/api/no-such-thing');
    const bad = await a.post('/api/auth/sign-in').send({ email: 'not an address' });
    expect(bad.status).toBe(400);
    const entries = parsed();
    for (const res of [ok, missing, bad]) {
      const id = res.headers['x-request-id'];
      const mine = entries.filter((e) => e.requestId === id);
      expect(mine.length, `log lines of request ${id}`).toBeGreaterThan(0);
      expect(mine.some((e) => e.res?.statusCode === res.status)).toBe(true);
    }
    expect(entries.every((e) => typeof e.requestId === 'string' && e.requestId.length > 0)).toBe(true);
    const text = lines.join('\n');
    expect(text).not.toContain('secret-search');
    expect(text).not.toMatch(/cookie|x-arcbench-request/i);
  });

  it('names the request id in every problem+json answer', async () => {
    const a = agent(t.app);
    for (const res of [await a.get('/api/no-such-thing'), await a.post('/api/auth/sign-in').send({}), await a.get('/api/me')]) {
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.requestId).toBe(res.headers['x-request-id']);
    }
  });
});
