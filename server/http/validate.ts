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

export function validate<S extends Schemas>(schemas: S): ValidateMiddleware<S> {
  const mw: RequestHandler = (req, res, next) => {
    const parsed: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
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
