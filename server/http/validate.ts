import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { HttpProblem, describeZodError, zodIssues } from './problem';

export interface Schemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

export type Parsed<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never;
};

/** Middleware tagged with its schemas, so the route table can document them. */
export type ValidateMiddleware<S extends Schemas> = RequestHandler & { schemas: S };

const PART_NAMES = { params: 'path parameters', query: 'query string', body: 'request body' } as const;

/**
 * The path of the first string holding a NUL character, if any. PostgreSQL
 * cannot store NUL in text, and no field of ours has a use for it, so every
 * text field of every route refuses it here, before any schema runs.
 */
export function findNul(value: unknown, path: string, depth = 0): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path : null;
  if (depth > 64 || value === null || typeof value !== 'object') return null;
  for (const [key, child] of Object.entries(value)) {
    if (key.includes('\u0000')) return `${path}.${key.replaceAll('\u0000', '\\0')}`;
    const found = findNul(child, `${path}.${key}`, depth + 1);
    if (found) return found;
  }
  return null;
}

export function validate<S extends Schemas>(schemas: S): ValidateMiddleware<S> {
  const mw: RequestHandler = (req, res, next) => {
    const parsed: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const nul = findNul(part === 'body' ? req.body : req[part], part);
      if (nul) {
        next(new HttpProblem(400, 'Invalid request', `${nul} contains a NUL character (\\0), which no field accepts.`, { errors: [{ path: nul, message: 'must not contain a NUL character' }] }));
        return;
      }
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(part === 'body' ? (req.body ?? {}) : req[part]);
      if (!result.success) {
        next(
          new HttpProblem(400, 'Invalid request', `Invalid ${PART_NAMES[part]}: ${describeZodError(result.error)}`, {
            errors: zodIssues(result.error).map((i) => ({ ...i, path: `${part}.${i.path}` })),
          }),
        );
        return;
      }
      parsed[part] = result.data;
    }
    res.locals.input = parsed;
    next();
  };
  return Object.assign(mw, { schemas });
}
