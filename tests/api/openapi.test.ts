import addFormats from 'ajv-formats';
import { Ajv2020 } from 'ajv/dist/2020.js';
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

  it('documents the success body of every route (a new route without a response schema fails here)', () => {
    const missing: string[] = [];
    for (const spec of specs) {
      const status = String(spec.status ?? 200);
      const success = op(spec).responses[status];
      expect(success, key(spec.method, spec.path)).toBeDefined();
      if (status === '204') continue;
      if (!Object.values(success.content ?? {}).some((m) => m.schema)) missing.push(key(spec.method, spec.path));
    }
    expect(missing, 'routes without a response schema').toEqual([]);
  });
});

describe('worked examples of the main flows (server/http/api-examples.ts)', () => {
  type Media = { schema?: object; example?: unknown };
  type ExampleOp = { requestBody?: { content: Record<string, Media> }; responses: Record<string, { content?: Record<string, Media> }> };
  const MAIN_FLOWS = [
    'POST /api/auth/sign-in',
    'POST /api/teams/:teamId/shots/:shotId/clips',
    'POST /api/teams/:teamId/clips/:clipId/calibrations',
    'PUT /api/teams/:teamId/tracks/:trackId/marks/:frameNumber',
    'POST /api/teams/:teamId/tracks/:trackId/fits',
    'POST /api/teams/:teamId/fits/:fitId/review',
  ];

  it('shows an answer example on sign-in, upload, calibrate, mark, run a fit and approve, and every example keeps the schema it illustrates', () => {
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    addFormats(ajv);
    const components = (doc as unknown as { components: object }).components;
    const broken: string[] = [];
    const withAnswerExample: string[] = [];
    for (const spec of specs) {
      const where = key(spec.method, spec.path);
      const operation = (doc.paths[openApiPath(spec.path)] as unknown as Record<string, ExampleOp>)[spec.method];
      const examples: [string, Media][] = [
        ...Object.values(operation.requestBody?.content ?? {}).map((m): [string, Media] => [`${where} request`, m]),
        ...Object.values(operation.responses[String(spec.status ?? 200)]?.content ?? {}).map((m): [string, Media] => [`${where} answer`, m]),
      ].filter(([, m]) => m.example !== undefined);
      for (const [what, media] of examples) {
        if (what.endsWith('answer')) withAnswerExample.push(where);
        const validate = ajv.compile({ ...media.schema, components });
        if (!validate(media.example)) broken.push(`${what}: ${ajv.errorsText(validate.errors, { dataVar: 'example' })}`);
      }
    }
    expect(broken).toEqual([]);
    expect(withAnswerExample).toEqual(expect.arrayContaining(MAIN_FLOWS));
  });

  it('would notice an example that breaks its schema', () => {
    const ajv = new Ajv2020({ strict: false });
    const signIn = (doc.paths['/api/auth/sign-in'] as unknown as Record<string, ExampleOp>).post.responses['200'].content!['application/json'];
    const validate = ajv.compile({ ...signIn.schema, components: (doc as unknown as { components: object }).components });
    expect(validate(signIn.example)).toBe(true);
    expect(validate({ ...(signIn.example as object), teams: [{ id: 'not a team' }] })).toBe(false);
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
