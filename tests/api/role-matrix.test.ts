// Generated from the route table: every declared route is checked signed out and
// for each of the five demo roles, so a new route is covered by being declared.
import { randomBytes, randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../shared/roles';
import { memberships, teams } from '../../server/db/schema/teams';
import type { RouteSpec } from '../../server/http/route-table';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../../server/seed/demo-people';
import { createTestApp, signInAs } from '../support/test-app';

// Many sign-ins from one address; the limiter itself is tested in auth-session.test.ts.
const t = await createTestApp({ signInLimitPerWindow: 10_000 });
const specs = t.app.locals.routeSpecs as RouteSpec[];
const [demoTeam] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
if (!demoTeam) throw new Error('the demo team is not seeded');

const demoMembers = () =>
  t.deps.db
    .select({ userId: memberships.userId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.teamId, demoTeam.id))
    .orderBy(memberships.userId);

const agents = new Map<Role, Awaited<ReturnType<typeof signInAs>>>();
let membersBefore: Awaited<ReturnType<typeof demoMembers>>;
beforeAll(async () => {
  for (const role of ROLES) agents.set(role, await signInAs(t.app, demoPerson(role).email, DEMO_PASSWORD));
  membersBefore = await demoMembers();
});
afterAll(() => t.close());

const NUMERIC_PARAM = /(number|index|version|frame|page|^n)$/i;

/**
 * Path parameters: the demo team, random ids (→ 404, harmless for PATCH/DELETE),
 * a random token, 0 for numbers. Demo data is never addressed by id, so allowed
 * requests cannot change it.
 */
function fillPath(path: string): string {
  return path.replace(/:(\w+)/g, (_m, name: string) => {
    if (name === 'teamId') return demoTeam.id;
    if (name === 'token') return randomBytes(32).toString('base64url');
    if (NUMERIC_PARAM.test(name)) return '0';
    return randomUUID();
  });
}

function call(client: request.Agent | ReturnType<typeof request>, spec: RouteSpec) {
  const url = fillPath(spec.path);
  const req = (client as request.Agent)[spec.method](url).set('X-Arcbench-Request', '1');
  // `{}` is never a valid body for a create or update, so allowed calls stop at validation.
  return spec.method === 'get' || spec.method === 'delete' ? req : req.send({});
}

const SIGN_OUT = '/api/auth/sign-out';

/**
 * Writes whose path names nothing but the team could act on demo data when `{}` happens
 * to be a valid body. Such a write must fail validation; one that may succeed is listed
 * here only once it is known not to change stored data.
 */
const HARMLESS_EMPTY_WRITES = new Set(['POST /api/auth/sign-out']);
const writesWithoutTarget = (spec: RouteSpec) => spec.method !== 'get' && !/:(?!teamId\b)\w+/.test(spec.path);
const label = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;
const cases = specs.map((spec) => ({ name: label(spec), spec }));

describe('route table', () => {
  it('has routes from every foundation resource', () => {
    const paths = new Set(specs.map((s) => s.path));
    for (const p of ['/api/auth/sign-in', '/api/teams', '/api/teams/:teamId/members', '/api/teams/:teamId/invitations', '/api/teams/:teamId/outbox', '/api/teams/:teamId/audit']) {
      expect(paths).toContain(p);
    }
  });
});

describe.each(cases)('$name', ({ spec }) => {
  if (spec.access.kind === 'team') {
    it('is scoped by :teamId', () => {
      expect(spec.path).toMatch(/\/:teamId(\/|$)/);
    });
  }

  it('signed out', async () => {
    const res = await call(request(t.app), spec);
    if (spec.access.kind === 'public') expect([401, 403], `${res.status} ${JSON.stringify(res.body)}`).not.toContain(res.status);
    else expect(res.status, JSON.stringify(res.body)).toBe(401);
  });

  it.each(ROLES)('as %s', async (role) => {
    // Signing out ends the session, so it gets an agent of its own.
    const client = spec.path === SIGN_OUT ? await signInAs(t.app, demoPerson(role).email, DEMO_PASSWORD) : agents.get(role)!;
    const res = await call(client, spec);
    const allowed = spec.access.kind !== 'team' || spec.access.roles.includes(role);
    if (allowed) expect([401, 403], `${res.status} ${JSON.stringify(res.body)}`).not.toContain(res.status);
    else expect(res.status, JSON.stringify(res.body)).toBe(403);
    if (allowed && writesWithoutTarget(spec) && !HARMLESS_EMPTY_WRITES.has(label(spec))) {
      expect(res.status, `${label(spec)} accepted an empty body as ${role}; it must validate its body (or be listed as harmless)`).toBeGreaterThanOrEqual(400);
    }
  });
});

describe('after the matrix', () => {
  it('the demo team still has the same people in the same roles', async () => {
    expect(await demoMembers()).toEqual(membersBefore);
  });
});
