import { z } from 'zod';
import type { RouteSpec } from './route-table';

function jsonSchema(schema: z.ZodType): Record<string, unknown> {
  // io: 'input' documents what a client sends (before transforms and defaults).
  const { $schema: _drop, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
  return rest;
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
        [String(spec.status ?? 200)]: {
          description: 'Success',
          ...(spec.produces ? { content: { [spec.produces]: {} } } : {}),
        },
        default: {
          description: 'Problem (RFC 7807)',
          content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } },
        },
      },
    };
    if (spec.schemas.body || spec.bodyType) {
      op.requestBody = {
        required: true,
        content: { [spec.bodyType ?? 'application/json']: { schema: spec.schemas.body ? jsonSchema(spec.schemas.body) : {} } },
      };
    }
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
        Problem: {
          type: 'object',
          required: ['type', 'title', 'status', 'detail'],
          properties: {
            type: { type: 'string' },
            title: { type: 'string' },
            status: { type: 'integer' },
            detail: { type: 'string' },
            instance: { type: 'string' },
            errors: { type: 'array', items: { type: 'object', properties: { path: { type: 'string' }, message: { type: 'string' } } } },
          },
        },
      },
    },
    paths,
  };
}
