import { existsSync } from 'node:fs';
import path from 'node:path';
import connectPgSimple from 'connect-pg-simple';
import express, { type RequestHandler } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { AppDeps } from './app-deps';
import { buildOpenApi } from './http/openapi';
import { HttpProblem, apiNotFound, problemHandler, sendProblem } from './http/problem';
import { RouteTable } from './http/route-table';
import { registerAllRoutes } from './routes/registry';

export const CSRF_HEADER = 'x-arcbench-request';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site requests cannot carry a custom header without a CORS preflight,
 * which this server never grants; with SameSite=Lax cookies that is our CSRF defence.
 */
const requireCsrfHeader: RequestHandler = (req, res, next) => {
  if (SAFE_METHODS.has(req.method) || req.get(CSRF_HEADER) === '1') return next();
  sendProblem(res, new HttpProblem(403, 'Missing request header', `State-changing requests must send the header X-Arcbench-Request: 1.`), req.originalUrl);
};

export function createApp(deps: AppDeps) {
  const app = express();
  app.locals.deps = deps;
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Frames are drawn to canvas from same-origin blobs.
          'img-src': ["'self'", 'data:', 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
      strictTransportSecurity: deps.config.production,
    }),
  );

  const PgStore = connectPgSimple(session);
  app.use(
    session({
      name: 'arcbench.sid',
      store: new PgStore({ pool: deps.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
      secret: deps.config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: 7 * 24 * 3600 * 1000 },
    }),
  );

  const api = new RouteTable();
  registerAllRoutes(api, deps);
  const openApi = buildOpenApi(api.specs, '0.1.0');
  app.locals.routeSpecs = api.specs;

  app.get('/api/openapi.json', (_req, res) => {
    res.json(openApi);
  });
  app.use('/api', requireCsrfHeader, express.json({ limit: '1mb' }));
  app.use(api.router);
  app.use('/api', apiNotFound);

  const dist = deps.config.clientDist;
  if (existsSync(path.join(dist, 'index.html'))) {
    app.use('/assets', express.static(path.join(dist, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false }));
    app.use(express.static(dist, { index: false }));
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(problemHandler);
  return app;
}
