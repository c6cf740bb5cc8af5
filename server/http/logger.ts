// Structured logs: one JSON object per line (pino), and one line per answered
// request (pino-http) carrying the same request id as the X-Request-Id header and
// any problem+json body, so a user's report leads to the server's lines.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Response } from 'express';
import { pino, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export type { Logger };

export function createLogger(level: string): Logger {
  return pino({ level, base: { service: 'arcbench' } });
}

/**
 * The request log middleware. Only the method, the path (no query string: it may carry
 * search text) and the status are logged; headers never are (cookies, CSRF header).
 */
export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (_req: IncomingMessage, res: ServerResponse) => String((res as Response).locals?.requestId ?? ''),
    // Every line written through req.log carries reqId, not only the completion line.
    quietReqLogger: true,
    customAttributeKeys: { reqId: 'requestId' },
    serializers: {
      req: (req: { method: string; url: string }) => ({ method: req.method, path: req.url.split('?')[0] }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
  });
}
