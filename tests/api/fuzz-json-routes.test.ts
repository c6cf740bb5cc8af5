// Generated from the route table (like the role matrix), so a new route is
// fuzzed by being declared. For every JSON route, as an admin of a team of its
// own: a plausible body (from the route's zod schema) with one field at a time
// replaced by a wrong type, an int4-overflowing or ±1e308 number, a NUL
// character, deep nesting or a long string; whole bodies that are not objects,
// 2 MB strings and `__proto__` keys; hostile numeric path parameters and query
// values. Every answer must be below 500, and every error problem+json.
import { randomBytes, randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords';
import { memberships, teams } from '../../server/db/schema/teams';
import { users } from '../../server/db/schema/users';
import type { RouteSpec } from '../../server/http/route-table';
import { leafPaths, withValue, zodSample } from '../support/zod-sample';
import { createTestApp, signInAs, uniqueSuffix } from '../support/test-app';

const t = await createTestApp({ signInLimitPerWindow: 1_000_000, signInAccountLimit: 1_000_000 });
const specs = t.app.locals.routeSpecs as RouteSpec[];
const suffix = uniqueSuffix();
const email = `fuzz.${suffix}@example.test`;
const password = `fuzz-password-${suffix}`;
let teamId: string;
let admin: Awaited<ReturnType<typeof signInAs>>;

beforeAll(async () => {
  // A user and team of their own: whatever the fuzz manages to change stays there.
  const [user] = await t.deps.db.insert(users).values({ email, displayName: 'Fuzz Admin', passwordHash: await hashPassword(password) }).returning({ id: users.id });
  const [team] = await t.deps.db.insert(teams).values({ name: `Fuzz ${suffix}`, slug: `fuzz-${suffix}` }).returning({ id: teams.id });
  teamId = team.id;
  await t.deps.db.insert(memberships).values({ teamId, userId: user.id, role: 'admin' });
  admin = await signInAs(t.app, email, password);
}, 60_000);
afterAll(() => t.close());

const deep = (levels: number) => JSON.parse('['.repeat(levels) + ']'.repeat(levels));
// One field at a time gets each of these.
const FIELD_VALUES: Array<[string, unknown]> = [
  ['a wrong type (string)', 'not-the-right-type'],
  ['a wrong type (object)', { a: 1 }],
  ['a wrong type (array)', [1, 'two']],
  ['null', null],
  ['2^31 (int4 overflow)', 2 ** 31],
  ['-2^31-1', -(2 ** 31) - 1],
  ['2^53+2', 2 ** 53 + 2],
  ['1e308', 1e308],
  ['-1e308', -1e308],
  ['a NUL character', 'before\u0000after'],
  ['100 000 characters', 'x'.repeat(100_000)],
  ['2000 levels of nesting', deep(2000)],
];
const BIG = 'y'.repeat(2 * 1024 * 1024);
// Whole bodies, sent as raw JSON text.
const RAW_BODIES: Array<[string, (sample: unknown) => string]> = [
  ['an array', () => '[1,2,3]'],
  ['a number', () => '1e308'],
  ['a string', () => '"\\u0000"'],
  ['null', () => 'null'],
  ['a 2 MB string', () => JSON.stringify({ text: BIG })],
  ['__proto__ keys', (s) => `{"__proto__":{"isAdmin":true,"role":"admin"},"constructor":{"prototype":{"x":1}},${JSON.stringify(s ?? {}).slice(1)}`],
  ['__proto__ inside a field', (s) => JSON.stringify(s ?? {}).replace(/^\{/, '{"nested":{"__proto__":{"polluted":true}},')],
  ['5000 levels of nesting', () => `{"a":${'['.repeat(5000)}${']'.repeat(5000)}}`],
  ['truncated JSON', (s) => JSON.stringify(s ?? {}).slice(0, -1)],
];
const HOSTILE_NUMBERS = ['2147483648', '-2147483649', '99999999999999999999', '1e308', '-1', 'NaN', 'abc', '0x10'];
const NUMERIC_PARAM = /(number|index|version|frame|page|^n)$/i;

function fillPath(path: string, numeric = '0'): string {
  return path.replace(/:(\w+)/g, (_m, name: string) => {
    if (name === 'teamId') return teamId;
    if (name === 'token') return randomBytes(32).toString('base64url');
    if (NUMERIC_PARAM.test(name)) return encodeURIComponent(numeric);
    return randomUUID();
  });
}

const label = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;
type Answer = { status: number; type: string; body: unknown };
const failures = (what: string, res: Answer) =>
  res.status >= 500 || (res.status >= 400 && !/^application\/problem\+json/.test(res.type)) ? [`${what} → ${res.status} ${res.type} ${JSON.stringify(res.body).slice(0, 200)}`] : [];

async function send(spec: RouteSpec, path: string, body?: string, query?: string): Promise<Answer> {
  // Signing out would end the admin's session: that route is fuzzed signed out.
  const client = spec.path === '/api/auth/sign-out' ? request(t.app) : admin;
  let req = (client as ReturnType<typeof request.agent>)[spec.method](query ? `${path}?${query}` : path).set('X-Arcbench-Request', '1');
  if (body !== undefined) req = req.set('Content-Type', 'application/json').send(body);
  const res = await req;
  return { status: res.status, type: String(res.headers['content-type'] ?? ''), body: res.body };
}

const jsonRoutes = specs.filter((s) => !s.bodyType);

describe('fuzzing every JSON route', () => {
  it('covers the route table', () => {
    expect(jsonRoutes.length).toBeGreaterThan(30);
  });

  describe.each(jsonRoutes.map((spec) => ({ name: label(spec), spec })))('$name', ({ spec }) => {
    it('answers every hostile input below 500, with problem+json for errors', async () => {
      const problems: string[] = [];
      const hasBody = spec.method !== 'get' && spec.method !== 'delete';
      const sample = spec.schemas.body ? zodSample(spec.schemas.body) : {};

      // Numeric path parameters.
      if (/:(\w+)/.test(spec.path) && [...spec.path.matchAll(/:(\w+)/g)].some((m) => NUMERIC_PARAM.test(m[1]))) {
        for (const n of HOSTILE_NUMBERS) problems.push(...failures(`path number ${n}`, await send(spec, fillPath(spec.path, n), hasBody ? JSON.stringify(sample) : undefined)));
      }
      const path = fillPath(spec.path);

      // Query values.
      const querySample = spec.schemas.query ? (zodSample(spec.schemas.query) as Record<string, unknown>) : { page: 1 };
      for (const key of Object.keys(querySample ?? {})) {
        for (const v of [...HOSTILE_NUMBERS, 'a\u0000b', 'z'.repeat(4000)]) {
          problems.push(...failures(`query ${key}=${v.slice(0, 20)}`, await send(spec, path, undefined, `${encodeURIComponent(key)}=${encodeURIComponent(v)}`)));
        }
        problems.push(...failures(`query ${key} twice`, await send(spec, path, undefined, `${key}=1&${key}=2`)));
        problems.push(...failures(`query ${key}[__proto__]`, await send(spec, path, undefined, `${key}[__proto__][x]=1`)));
      }
      if (!hasBody) {
        problems.push(...failures('plain call', await send(spec, path)));
        expect(problems).toEqual([]);
        return;
      }

      // One field at a time.
      for (const leaf of leafPaths(sample)) {
        for (const [what, value] of FIELD_VALUES) {
          const body = JSON.stringify(withValue(sample, leaf, value));
          problems.push(...failures(`body.${leaf.join('.')} = ${what}`, await send(spec, path, body)));
        }
      }
      for (const [what, make] of RAW_BODIES) problems.push(...failures(`body: ${what}`, await send(spec, path, make(sample))));
      expect(problems).toEqual([]);
    }, 300_000);
  });

  it('left Object.prototype alone', () => {
    expect(({} as Record<string, unknown>).isAdmin).toBeUndefined();
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});
