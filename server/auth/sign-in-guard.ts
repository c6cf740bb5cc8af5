// Puts the sign-in limits (sign-in-limits.ts) in front of POST /api/auth/sign-in:
// refuses while the account or the address is over its limit, and counts the
// answer once it is sent (401 = a failure; 200 = a success, which clears the account).
import type { RequestHandler } from 'express';
import { sendProblem, HttpProblem } from '../http/problem';
import type { SignInLimiter } from './sign-in-limits';

export function signInGuard(limiter: SignInLimiter): RequestHandler {
  return (req, res, next) => {
    const email = typeof req.body?.email === 'string' ? req.body.email : null;
    if (email === null) return next(); // validation answers 400; nothing to count
    const address = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    try {
      limiter.check(email, address);
    } catch (err) {
      if (!(err instanceof HttpProblem)) return next(err);
      const retry = Number(err.extra.retryAfterSeconds);
      if (Number.isFinite(retry) && retry > 0) res.set('Retry-After', String(retry));
      return sendProblem(res, err, req.originalUrl);
    }
    res.once('finish', () => {
      if (res.statusCode === 401) limiter.failed(email, address);
      else if (res.statusCode >= 200 && res.statusCode < 300) limiter.succeeded(email);
    });
    next();
  };
}
