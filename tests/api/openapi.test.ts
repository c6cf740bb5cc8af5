import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteSpec } from '../../server/http/route-table';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let doc: { openapi: string; paths: Record<string, Record<string, { 'x-access': unknown; parameters: { name: string; in: string }[] }>> };
let specs: RouteSpec[];
beforeAll(async () => {
  t = await createTestApp();
  specs = t.app.locals.routeSpecs as RouteSpec[];
  const res = await request(t.app).get('/api/openapi.json');
  expect(res.status).toBe(200);
  doc = res.body;
});
afterAll(() => t.close());

const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');
const key = (method: string, path: string) => `${method.toUpperCase()} ${path}`;

describe('/api/openapi.json', () => {
  it('is OpenAPI 3.1', () => {
    // OpenAPI Specification 3.1.0: the `openapi` field carries the version of the specification.
    expect(doc.openapi).toMatch(/^3\.1\.\d+$/);
  });

  it('documents exactly the routes in the route table', () => {
    const declared = new Set(specs.map((s) => key(s.method, openApiPath(s.path))));
    const documented = new Set(Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => key(m, path))));
    expect(declared.size).toBe(specs.length); // no route declared twice
    expect([...documented].sort()).toEqual([...declared].sort());
  });

  it('states each route’s access and path parameters', () => {
    for (const spec of specs) {
      const op = doc.paths[openApiPath(spec.path)][spec.method];
      const expected = spec.access.kind === 'team' ? { kind: 'team', roles: [...spec.access.roles] } : { kind: spec.access.kind };
      expect(op['x-access'], key(spec.method, spec.path)).toEqual(expected);
      const pathParams = [...spec.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
      expect(op.parameters.filter((p) => p.in === 'path').map((p) => p.name)).toEqual(pathParams);
    }
  });

  it('lists the foundation’s team routes with admin-only access where members are managed', () => {
    expect(doc.paths['/api/teams/{teamId}/invitations'].post['x-access']).toEqual({ kind: 'team', roles: ['admin'] });
    expect(doc.paths['/api/invitations/{token}/accept'].post['x-access']).toEqual({ kind: 'public' });
    expect(doc.paths['/api/mail'].get['x-access']).toEqual({ kind: 'signed-in' });
  });
});
