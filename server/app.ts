import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import connectPgSimple from 'connect-pg-simple';
import express, { type RequestHandler } from 'express';
import expressStaticGzip from 'express-static-gzip';
import session from 'express-session';
import helmet from 'helmet';
import type { AppDeps } from './app-deps';
import { sessionGuard } from './auth/session-guard';
import { signInGuard } from './auth/sign-in-guard';
import { SignInLimiter } from './auth/sign-in-limits';
import { createLogger, requestLogger } from './http/logger';
import { buildOpenApi } from './http/openapi';
import { HttpProblem, apiNotFound, problemHandler, sendProblem } from './http/problem';
import { RouteTable } from './http/route-table';
import { registerAllRoutes } from './routes/registry';

export const CSRF_HEADER = 'x-arcbench-request';
const SWAGGER_UI_DIR = path.dirname(createRequire(import.meta.url).resolve('swagger-ui-dist/package.json'));
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
  // Off unless TRUST_PROXY says otherwise: then no caller can choose req.ip (the sign-in limiter's key) with a header.
  app.set('trust proxy', deps.config.trustProxy);
  app.disable('x-powered-by');
  app.use((_req, res, next) => {
    res.locals.requestId = randomUUID();
    res.set('X-Request-Id', res.locals.requestId);
    next();
  });
  app.use(requestLogger(deps.logger ?? createLogger(deps.config.logLevel)));
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
      // The idle timeout: every answer moves the cookie's expiry on (rolling); sessionGuard adds the absolute limit.
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: deps.config.sessionIdleMs },
    }),
  );
  app.use('/api', sessionGuard(deps.db, deps.config.sessionAbsoluteMs));

  const api = new RouteTable();
  registerAllRoutes(api, deps);
  const openApi = buildOpenApi(api.specs, '0.1.0');
  app.locals.routeSpecs = api.specs;

  app.get('/api/openapi.json', (_req, res) => {
    res.json(openApi);
  });
  // A readable API reference rendered from that document by swagger-ui-dist, served from
  // node_modules (no CDN). Read-only: no "try it out", no outside validator badge.
  app.get('/api/reference/swagger-initializer.js', (_req, res) => {
    res.type('text/javascript').send(
      `window.onload = () => { window.ui = SwaggerUIBundle({ url: '/api/openapi.json', dom_id: '#swagger-ui', deepLinking: true, supportedSubmitMethods: [], validatorUrl: null, presets: [SwaggerUIBundle.presets.apis] }); };`,
    );
  });
  app.get('/api/reference', (req, res, next) => (req.path.endsWith('/') ? next() : res.redirect(301, '/api/reference/')));
  app.use('/api/reference', express.static(SWAGGER_UI_DIR, { index: 'index.html' }));
  app.use('/api', requireCsrfHeader, express.json({ limit: deps.config.jsonLimitBytes }));
  const signInLimiter = new SignInLimiter({ windowMs: 15 * 60 * 1000, accountLimit: deps.config.signInAccountLimit, addressLimit: deps.config.signInLimitPerWindow });
  app.locals.signInLimiter = signInLimiter;
  app.post('/api/auth/sign-in', signInGuard(signInLimiter));
  app.use(api.router);
  app.use('/api', apiNotFound);

  const dist = deps.config.clientDist;
  if (existsSync(path.join(dist, 'index.html'))) {
    // Hashed file names never change content: cache them for a year. The build wrote .br and .gz
    // twins (vite.config.ts); express-static-gzip picks the one Accept-Encoding allows and sets
    // Content-Encoding and Vary. Precompressed rather than `compression` middleware: brotli at
    // its best setting once at build time, no CPU per request, and API answers stay uncompressed.
    app.use('/assets', expressStaticGzip(path.join(dist, 'assets'), { enableBrotli: true, orderPreference: ['br', 'gzip'], serveStatic: { immutable: true, maxAge: '1y', fallthrough: false } }));
    app.use(express.static(dist, { index: false }));
    // index.html names the current hashed assets, so the browser must ask again each time (it may keep an ETag).
    app.get(/^(?!\/api\/).*/, (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(path.join(dist, 'index.html'));
    });
  }
  app.use(problemHandler);
  return app;
}
