import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';

/** An error the API reports to the caller as an RFC 7807 problem document. */
export class HttpProblem extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(detail);
  }
}

export const badRequest = (detail: string, extra?: Record<string, unknown>) => new HttpProblem(400, 'Bad request', detail, extra);
export const unauthorized = (detail = 'Sign in to continue.') => new HttpProblem(401, 'Not signed in', detail);
export const forbidden = (detail: string) => new HttpProblem(403, 'Not allowed', detail);
export const notFound = (detail: string) => new HttpProblem(404, 'Not found', detail);
export const conflict = (detail: string, extra?: Record<string, unknown>) => new HttpProblem(409, 'Conflict', detail, extra);
export const gone = (detail: string) => new HttpProblem(410, 'Gone', detail);
export const unprocessable = (detail: string, extra?: Record<string, unknown>) =>
  new HttpProblem(422, 'Cannot process', detail, extra);

const PROBLEM_TYPE_BASE = '/problems/';

function slug(title: string): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/(^-|-$)/g, '');
}

export function zodIssues(error: ZodError): { path: string; message: string }[] {
  return error.issues.map((issue) => ({ path: issue.path.join('.') || '(body)', message: issue.message }));
}

export function describeZodError(error: ZodError): string {
  return zodIssues(error)
    .map((i) => `${i.path} ${i.message}`)
    .join('; ');
}

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  limit?: number;
}

function toProblem(err: unknown): HttpProblem {
  if (err instanceof HttpProblem) return err;
  if (err instanceof ZodError) {
    return new HttpProblem(400, 'Invalid request', describeZodError(err), { errors: zodIssues(err) });
  }
  // PostgreSQL's data exceptions (SQLSTATE class 22: a number out of range for its
  // column, text it cannot store, a malformed value) are the request's fault, not
  // the server's: a backstop for any bound a schema still misses.
  for (let c = err as { code?: unknown; cause?: unknown } | undefined, depth = 0; c && depth < 5; c = c.cause as typeof c, depth++) {
    if (typeof c.code === 'string' && /^22[0-9A-Z]{3}$/.test(c.code)) {
      const what = c.code === '22003' ? 'A number in the request is out of range.' : 'A value in the request cannot be stored as given.';
      return new HttpProblem(400, 'Value out of range', `${what} Check the numbers and text you sent.`, { sqlState: c.code });
    }
  }
  const e = err as BodyParserError;
  if (e?.type === 'entity.parse.failed') return badRequest('The request body is not valid JSON.');
  if (e?.type === 'entity.too.large') {
    return new HttpProblem(413, 'Request body too large', `The request body is larger than the ${e.limit ?? ''} byte limit.`.replace('  ', ' '));
  }
  if (e?.type === 'encoding.unsupported' || e?.type === 'charset.unsupported') return badRequest('Unsupported body encoding.');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) return new HttpProblem(e.status, 'Bad request', e.message);
  return new HttpProblem(500, 'Internal error', 'Something went wrong on the server. It has been logged; try again.');
}

export function sendProblem(res: Parameters<RequestHandler>[1], problem: HttpProblem, instance?: string): void {
  res
    .status(problem.status)
    .type('application/problem+json')
    .send(
      JSON.stringify({
        type: `${PROBLEM_TYPE_BASE}${slug(problem.title)}`,
        title: problem.title,
        status: problem.status,
        detail: problem.detail,
        instance,
        ...problem.extra,
        // The same id as the X-Request-Id header and the server's log lines, so a report can be traced.
        requestId: String(res.locals.requestId ?? ''),
      }),
    );
}

/**
 * One log line for a 500 that carries no user input: error class, database
 * error code, the message with quoted values removed and SQL cut off, and the
 * top stack frames. Never the query's parameters, the body or the URL's query.
 */
export function describeErrorForLog(err: unknown): string {
  const parts: string[] = [];
  for (let e = err as { name?: string; code?: unknown; message?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; e = e.cause as typeof e, depth++) {
    const firstLine = String(e.message ?? '').split('\n')[0];
    const message = /^Failed query/i.test(firstLine)
      ? 'Failed query (SQL and parameters not logged)'
      : firstLine.replace(/"[^"]*"|'[^']*'|`[^`]*`/g, '…').replace(/\b\d{6,}\b/g, '…').slice(0, 200);
    parts.push(`${e.name ?? 'Error'}${typeof e.code === 'string' ? ` [${e.code}]` : ''}: ${message}`);
  }
  const stack = String((err as Error)?.stack ?? '')
    .split('\n')
    .filter((l) => /^\s+at /.test(l))
    .slice(0, 3)
    .map((l) => l.trim())
    .join(' | ');
  return `${parts.join(' ← caused by ')}${stack ? ` (${stack})` : ''}`;
}

/** The one error middleware: everything becomes problem+json, never a stack trace. */
export const problemHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let problem = toProblem(err);
  if (problem.status >= 500) {
    const requestId = String(res.locals.requestId ?? '-');
    // The route pattern, not the URL: ids and query strings stay out of the log.
    // req.log (pino-http) stamps the line with the request id; the fallback covers a request that never reached it.
    const line = `500 on ${req.method} ${req.route?.path ?? req.baseUrl ?? ''}: ${describeErrorForLog(err)}`;
    if (req.log) req.log.error({ route: req.route?.path }, line);
    else console.error(`[api] ${line} request ${requestId}`);
    problem = new HttpProblem(problem.status, problem.title, `${problem.detail} (request ${requestId})`, { ...problem.extra, requestId });
  }
  if (res.headersSent) {
    res.end();
    return;
  }
  sendProblem(res, problem, req.originalUrl);
};

export const apiNotFound: RequestHandler = (req, res) => {
  sendProblem(res, notFound(`No API route ${req.method} ${req.path}.`), req.originalUrl);
};
