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

// Routes whose success body has no schema yet: the list only shrinks. A new route without a
// response schema fails the test below, and so does a route listed here that has one now.
const RESPONSE_SCHEMA_PENDING = new Set([
  'GET /api/teams/:teamId/presets',
  'POST /api/teams/:teamId/presets',
  'GET /api/teams/:teamId/presets/:presetId',
  'GET /api/teams/:teamId/presets/:presetId/candidates',
  'POST /api/teams/:teamId/presets/:presetId/pool-preview',
  'POST /api/teams/:teamId/presets/:presetId/versions',
  'GET /api/teams/:teamId/presets/:presetId/versions/:version',
  'GET /api/teams/:teamId/presets/:presetId/versions/:version/diff',
  'POST /api/teams/:teamId/presets/:presetId/versions/:version/comparisons',
  'GET /api/teams/:teamId/presets/:presetId/keep-out',
  'GET /api/teams/:teamId/presets/:presetId/measured-vs-forecast',
  'POST /api/teams/:teamId/forecast',
  'GET /api/teams/:teamId/fits/:fitId/preset-comparisons',
]);

describe('every route has request and response schemas in the document', () => {
  type Op = { requestBody?: { content: Record<string, { schema?: { properties?: Record<string, unknown>; type?: string } }> }; responses: Record<string, { content?: Record<string, { schema?: object }> }> };
  const op = (spec: RouteSpec) => (doc.paths[openApiPath(spec.path)] as unknown as Record<string, Op>)[spec.method];

  it('documents the body schema of every route that takes a body', () => {
    for (const spec of specs.filter((s) => s.schemas.body || s.bodyType)) {
      const content = op(spec).requestBody?.content ?? {};
      const [type, media] = Object.entries(content)[0] ?? [];
      expect(media?.schema, key(spec.method, spec.path)).toBeTruthy();
      if (type === 'application/json') expect(media!.schema!.type, key(spec.method, spec.path)).toBeDefined();
    }
  });

  it('documents the clip upload with its file part (multipart)', () => {
    const upload = specs.find((s) => s.bodyType === 'multipart/form-data')!;
    const schema = op(upload).requestBody!.content['multipart/form-data'].schema as { properties: Record<string, { contentMediaType?: string }>; required: string[] };
    expect(schema.properties.file.contentMediaType).toBe('application/octet-stream');
    expect(schema.required).toContain('file');
    expect(schema.properties.captureFps).toBeDefined();
  });

  it('documents every error as application/problem+json with a request id', () => {
    for (const spec of specs) expect(op(spec).responses.default.content?.['application/problem+json']?.schema, key(spec.method, spec.path)).toEqual({ $ref: '#/components/schemas/Problem' });
    const problem = (doc as unknown as { components: { schemas: { Problem: { required: string[] } } } }).components.schemas.Problem;
    expect(problem.required).toEqual(expect.arrayContaining(['type', 'title', 'status', 'detail', 'requestId']));
  });

  it('documents the success body of every route (except the pending list, which only shrinks)', () => {
    const missing: string[] = [];
    for (const spec of specs) {
      const status = String(spec.status ?? 200);
      const success = op(spec).responses[status];
      expect(success, key(spec.method, spec.path)).toBeDefined();
      if (status === '204') continue;
      if (!Object.values(success.content ?? {}).some((m) => m.schema)) missing.push(key(spec.method, spec.path));
    }
    expect(missing.filter((k) => !RESPONSE_SCHEMA_PENDING.has(k)), 'routes added without a response schema').toEqual([]);
    expect([...RESPONSE_SCHEMA_PENDING].filter((k) => !missing.includes(k)), 'documented now: remove them from RESPONSE_SCHEMA_PENDING').toEqual([]);
  });
});

describe('the contract check (tests/support/contract.ts) that every API test runs', () => {
  it('records an answer whose body breaks its documented schema, and passes one that keeps it', async () => {
    const { z } = await import('zod');
    const express = (await import('express')).default;
    const { RouteTable } = await import('../../server/http/route-table');
    const { buildOpenApi } = await import('../../server/http/openapi');
    const { open } = await import('../../server/auth/access');
    const { installContractCheck } = await import('../support/contract');
    const api = new RouteTable();
    const Answer = z.object({ speedMps: z.number() });
    api.get('/api/right', { summary: 'keeps it', response: Answer }, open, (_req, res) => void res.json({ speedMps: 23.4 }));
    api.get('/api/wrong', { summary: 'breaks it', response: Answer }, open, (_req, res) => void res.json({ speedMps: 'fast' }));
    const app = express();
    app.use(api.router);
    const check = installContractCheck(app, buildOpenApi(api.specs, 'test') as never);
    await request(app).get('/api/right');
    expect(check.violations).toEqual([]);
    await request(app).get('/api/wrong');
    expect(check.checked).toBe(2);
    expect(check.violations).toHaveLength(1);
    expect(check.violations[0]).toMatch(/GET \/api\/wrong → 200: .*speedMps/);
  });

  it('checked this file’s own answers (the problem of an unknown route among them)', async () => {
    const res = await request(t.app).get('/api/no-such-route');
    expect(res.status).toBe(404);
    expect(res.body.requestId).toBe(res.headers['x-request-id']);
    expect(t.contract.checked).toBeGreaterThan(0);
    expect(t.contract.violations).toEqual([]);
  });
});

describe('/api/reference', () => {
  it('serves a readable reference of the document from local files (swagger-ui-dist, no CDN)', async () => {
    const page = await request(t.app).get('/api/reference/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('swagger-ui');
    expect(page.text).not.toMatch(/https?:\/\//);
    const init = await request(t.app).get('/api/reference/swagger-initializer.js');
    expect(init.text).toContain("url: '/api/openapi.json'");
    const bundle = await request(t.app).get('/api/reference/swagger-ui-bundle.js');
    expect(bundle.status).toBe(200);
    expect(bundle.headers['content-type']).toMatch(/javascript/);
  });
});
