import { z } from 'zod';
import { Problem } from '../../shared/schemas/common';
import type { RouteSpec } from './route-table';

/**
 * io 'input' documents what a client sends (before transforms and defaults);
 * 'output' what the server answers (after them).
 */
function jsonSchema(schema: z.ZodType, io: 'input' | 'output' = 'input'): Record<string, unknown> {
  const { $schema: _drop, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as Record<string, unknown>;
  return rest;
}

/** Every problem names the request it answers (also in the server's log lines); some add fields of their own. */
const ProblemDocument = Problem.extend({ requestId: z.string() }).loose();

/** The request body: JSON from the route's zod schema, or the multipart upload with its file part. */
function requestBody(spec: RouteSpec) {
  const type = spec.bodyType ?? 'application/json';
  const body = spec.schemas.body ? jsonSchema(spec.schemas.body) : { type: 'object', properties: {} };
  if (type === 'multipart/form-data') {
    const props = (body.properties ?? {}) as Record<string, unknown>;
    const required = (body.required ?? []) as string[];
    // OpenAPI 3.1 (§4.8.14.3): a binary part is a string with contentMediaType, sent as its own part.
    const schema = { ...body, type: 'object', properties: { file: { type: 'string', contentMediaType: 'application/octet-stream', description: 'The file itself' }, ...props }, required: ['file', ...required] };
    const media: Record<string, unknown> = { schema, encoding: { file: { contentType: 'video/*, application/octet-stream' } } };
    if (spec.example?.request !== undefined) media.example = spec.example.request;
    return { required: true, content: { [type]: media } };
  }
  const media: Record<string, unknown> = { schema: type === 'application/json' ? body : { type: 'string' } };
  if (spec.example?.request !== undefined) media.example = spec.example.request;
  return { required: true, content: { [type]: media } };
}

function successResponse(spec: RouteSpec) {
  if ((spec.status ?? 200) === 204) return { description: 'Done; no body' };
  if (spec.produces) {
    // A JSON download is still a JSON value on the wire (described by its response schema when it has one); only text and binary downloads are strings.
    const schema = spec.produces === 'application/json' ? (spec.response ? jsonSchema(spec.response, 'output') : { type: 'object' }) : { type: 'string', contentMediaType: spec.produces };
    return { description: 'Success', content: { [spec.produces]: { schema } } };
  }
  if (!spec.response) return { description: 'Success' };
  const media: Record<string, unknown> = { schema: jsonSchema(spec.response, 'output') };
  if (spec.example?.response !== undefined) media.example = spec.example.response;
  return { description: 'Success', content: { 'application/json': media } };
}

function accessText(spec: RouteSpec): string {
  switch (spec.access.kind) {
    case 'public':
      return 'Public.';
    case 'signed-in':
      return 'Any signed-in user.';
    case 'team':
      return `Team members with role: ${spec.access.roles.join(', ')}.`;
  }
}

function parameters(spec: RouteSpec) {
  const out: Record<string, unknown>[] = [];
  const pathNames = [...spec.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
  const paramSchema = spec.schemas.params ? (jsonSchema(spec.schemas.params) as { properties?: Record<string, unknown> }) : {};
  for (const name of pathNames) {
    out.push({ name, in: 'path', required: true, schema: paramSchema.properties?.[name] ?? { type: 'string' } });
  }
  if (spec.schemas.query) {
    const q = jsonSchema(spec.schemas.query) as { properties?: Record<string, unknown>; required?: string[] };
    for (const [name, schema] of Object.entries(q.properties ?? {})) {
      out.push({ name, in: 'query', required: q.required?.includes(name) ?? false, schema });
    }
  }
  return out;
}

/** OpenAPI 3.1 built from the route table, so every declared route is listed with its access. */
export function buildOpenApi(specs: RouteSpec[], version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const spec of specs) {
    const path = spec.path.replace(/:(\w+)/g, '{$1}');
    const op: Record<string, unknown> = {
      summary: spec.summary,
      description: accessText(spec),
      tags: [spec.tag],
      operationId: `${spec.method}${path.replace(/[{}]/g, '').replace(/[^a-zA-Z0-9]+(.)?/g, (_m, c: string | undefined) => (c ?? '').toUpperCase())}`,
      parameters: parameters(spec),
      'x-access': spec.access.kind === 'team' ? { kind: 'team', roles: spec.access.roles } : { kind: spec.access.kind },
      security: spec.access.kind === 'public' ? [] : [{ session: [] }],
      responses: {
        [String(spec.status ?? 200)]: successResponse(spec),
        default: {
          description: 'Problem (RFC 7807)',
          content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } },
        },
      },
    };
    if (spec.schemas.body || spec.bodyType) op.requestBody = requestBody(spec);
    (paths[path] ??= {})[spec.method] = op;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Arcbench API',
      version,
      description:
        'Shot clips, calibration, marks, fits and design presets for launcher test teams. Every error is application/problem+json (RFC 7807). State-changing requests need the header `X-Arcbench-Request: 1`.',
    },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'arcbench.sid' } },
      schemas: {
        Problem: jsonSchema(ProblemDocument, 'output'),
      },
    },
    paths,
  };
}
