// Runtime settings, read once from the environment. scripts/start.mjs and
// scripts/test.mjs set these; nothing else reads process.env.
import path from 'node:path';

export interface Config {
  databaseUrl: string;
  host: string;
  port: number;
  publicUrl: string;
  sessionSecret: string;
  production: boolean;
  /** When unset, a local fake SMTP server stores mail in the database. */
  smtpUrl: string | null;
  mailFrom: string;
  storageDir: string;
  uploadLimitBytes: number;
  signInLimitPerWindow: number;
  /** Start the job worker inside the server process. */
  inProcessWorker: boolean;
  jpegQuality: number;
  /** PostgreSQL schema of the job queue (pg-boss); tests give each worker set its own. */
  jobSchema: string;
  /** A running extraction that has not reported for this long is presumed dead and retried. */
  jobStaleSeconds: number;
  /** The built client (vite build output) to serve, if present. */
  clientDist: string;
}

function int(value: string | undefined, fallback: number): number {
  const n = value === undefined || value === '' ? NaN : Number(value);
  return Number.isFinite(n) ? n : fallback;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start and npm test set it for you).');
  const host = env.HOST ?? '127.0.0.1';
  const port = int(env.PORT, 5180);
  const production = env.NODE_ENV === 'production';
  const sessionSecret = env.SESSION_SECRET ?? '';
  if (production && sessionSecret.length < 32) throw new Error('SESSION_SECRET must be at least 32 characters in production.');
  return {
    databaseUrl,
    host,
    port,
    publicUrl: env.PUBLIC_URL ?? `http://${host}:${port}`,
    sessionSecret: sessionSecret || 'arcbench-development-secret-not-for-production',
    production,
    smtpUrl: env.SMTP_URL || null,
    mailFrom: env.MAIL_FROM ?? 'Arcbench <no-reply@arcbench.invalid>',
    storageDir: path.resolve(env.STORAGE_DIR ?? '.data/storage'),
    uploadLimitBytes: int(env.UPLOAD_LIMIT_BYTES, 2 * 1024 ** 3),
    signInLimitPerWindow: int(env.SIGN_IN_LIMIT, 10),
    inProcessWorker: env.IN_PROCESS_WORKER !== 'false',
    jpegQuality: int(env.JPEG_QUALITY, 90),
    jobSchema: env.JOB_SCHEMA || 'pgboss',
    jobStaleSeconds: int(env.JOB_STALE_SECONDS, 30),
    clientDist: path.resolve(env.CLIENT_DIST ?? 'dist'),
  };
}
