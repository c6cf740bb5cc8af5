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
  /** Failed sign-ins per address in 15 minutes (high enough for a team behind one NAT). */
  signInLimitPerWindow: number;
  /** Failed sign-ins per account in 15 minutes before the account locks (it unlocks by itself). */
  signInAccountLimit: number;
  /**
   * Express 'trust proxy': false (default) uses the socket's address, so a forwarded
   * header cannot choose the rate limiter's key; set TRUST_PROXY to a hop count, a
   * subnet list or 'loopback' when a reverse proxy sits in front.
   */
  trustProxy: boolean | number | string;
  /** Seed the demo team (never in production or with ARCBENCH_DEMO=off). */
  demo: boolean;
  /** A session ends after this much inactivity (rolling)... */
  sessionIdleMs: number;
  /** ...and in any case this long after sign-in. */
  sessionAbsoluteMs: number;
  /** Largest JSON request body in bytes (413 above). */
  jsonLimitBytes: number;
  /** Cap on frames × width × height of one extraction (decoded pixels). */
  maxDecodedPixels: number;
  /** Bytes of clips and frames one team may keep. */
  teamStorageQuotaBytes: number;
  /** Start the job worker inside the server process. */
  inProcessWorker: boolean;
  jpegQuality: number;
  /** PostgreSQL schema of the job queue (pg-boss); tests give each worker set its own. */
  jobSchema: string;
  /** A running extraction that has not reported for this long is presumed dead and retried. */
  jobStaleSeconds: number;
  /** The built client (vite build output) to serve, if present. */
  clientDist: string;
  /** pino level of the server's structured logs (LOG_LEVEL: trace … fatal, or silent). */
  logLevel: string;
  /** Where clips and frames live: local disk (storageDir) unless STORAGE_URL is s3://bucket/prefix. */
  storage: StorageSettings;
  /** A worker's own scratch folder (swept at start, removed on exit); null: a per-process folder in the OS temp dir. */
  scratchDir: string | null;
  /** Jobs one worker process runs at the same time. */
  workerConcurrency: number;
  /** On SIGTERM a worker lets its running jobs finish this long, then hands them back to the queue. */
  workerStopGraceSeconds: number;
}

export type StorageSettings = { kind: 'local' } | ({ kind: 's3' } & S3Settings);

export interface S3Settings {
  bucket: string;
  /** Key prefix inside the bucket ('' or ending in '/'). */
  prefix: string;
  /** Null: AWS itself. Set for S3-compatible stores (MinIO, Ceph, the test fake). */
  endpoint: string | null;
  forcePathStyle: boolean;
  region: string;
  /** Null: the SDK's default credential chain (instance role, ~/.aws). */
  credentials: { accessKeyId: string; secretAccessKey: string } | null;
  /**
   * Send checksums only where S3 requires them. Many S3-compatible stores keep the
   * SDK's aws-chunked framing as data; the default is on whenever S3_ENDPOINT is set.
   */
  checksumsWhenRequired: boolean;
}

/** `s3://bucket/some/prefix` → bucket and prefix; anything else is an error a person can act on. */
export function parseStorageUrl(url: string): { bucket: string; prefix: string } {
  const m = /^s3:\/\/([^/]+)(?:\/(.*))?$/.exec(url);
  if (!m) throw new Error(`STORAGE_URL must look like s3://bucket/prefix (got ${url}).`);
  const bucket = m[1];
  if (!/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/.test(bucket)) throw new Error(`STORAGE_URL: bucket names are 3–63 lower-case letters, digits, dots and hyphens (got ${bucket}).`);
  const prefix = (m[2] ?? '').replace(/^\/+|\/+$/g, '');
  return { bucket, prefix: prefix ? `${prefix}/` : '' };
}

function storageSettings(env: NodeJS.ProcessEnv): StorageSettings {
  const url = env.STORAGE_URL?.trim();
  if (!url || url.startsWith('file:')) return { kind: 'local' };
  const { bucket, prefix } = parseStorageUrl(url);
  const endpoint = env.S3_ENDPOINT?.trim() || null;
  const keyId = env.AWS_ACCESS_KEY_ID?.trim();
  const secret = env.AWS_SECRET_ACCESS_KEY?.trim();
  return {
    kind: 's3',
    bucket,
    prefix,
    endpoint,
    forcePathStyle: env.S3_FORCE_PATH_STYLE === undefined ? endpoint !== null : env.S3_FORCE_PATH_STYLE === 'true',
    region: env.AWS_REGION?.trim() || 'us-east-1',
    credentials: keyId && secret ? { accessKeyId: keyId, secretAccessKey: secret } : null,
    checksumsWhenRequired: env.S3_CHECKSUMS ? env.S3_CHECKSUMS === 'when-required' : endpoint !== null,
  };
}

function int(value: string | undefined, fallback: number): number {
  const n = value === undefined || value === '' ? NaN : Number(value);
  return Number.isFinite(n) ? n : fallback;
}

/** TRUST_PROXY: unset/false/off → false; true; a hop count; or Express's names and subnets ('loopback', '10.0.0.0/8, fc00::/7'). */
export function trustProxySetting(value: string | undefined): boolean | number | string {
  const v = (value ?? '').trim();
  if (v === '' || /^(false|off|no|0)$/i.test(v)) return false;
  if (/^(true|on|yes)$/i.test(v)) return true;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

/**
 * The ffmpeg and ffprobe binaries (FFMPEG_PATH, FFPROBE_PATH; by default whatever PATH finds).
 * Functions rather than Config fields: the media module and the health probe run in the
 * server, the worker and the command-line tools alike, none of which hands them a Config.
 */
export function ffmpegBinary(env: NodeJS.ProcessEnv = process.env): string {
  return env.FFMPEG_PATH || 'ffmpeg';
}

export function ffprobeBinary(env: NodeJS.ProcessEnv = process.env): string {
  return env.FFPROBE_PATH || 'ffprobe';
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start and npm test set it for you).');
  const host = env.HOST ?? '127.0.0.1';
  const port = int(env.PORT, 5180);
  // Production mode: NODE_ENV=production, or ARCBENCH_DEMO=off (a real installation started with npm start).
  const production = env.NODE_ENV === 'production' || /^(off|false|no|0)$/i.test(env.ARCBENCH_DEMO ?? '');
  const demo = !production;
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
    signInLimitPerWindow: int(env.SIGN_IN_LIMIT, 100),
    signInAccountLimit: int(env.SIGN_IN_ACCOUNT_LIMIT, 10),
    trustProxy: trustProxySetting(env.TRUST_PROXY),
    demo,
    sessionIdleMs: int(env.SESSION_IDLE_MINUTES, production ? 120 : 7 * 24 * 60) * 60_000,
    sessionAbsoluteMs: int(env.SESSION_MAX_HOURS, production ? 12 : 7 * 24) * 3_600_000,
    jsonLimitBytes: int(env.JSON_LIMIT_BYTES, 1024 * 1024),
    // 2 gigapixels: 1000 frames of 1920×1080, or 2000 of 1280×720 (a long high-speed shot).
    maxDecodedPixels: int(env.MAX_DECODED_PIXELS, 2_000_000_000),
    teamStorageQuotaBytes: int(env.TEAM_STORAGE_QUOTA_BYTES, 50 * 1024 ** 3),
    inProcessWorker: env.IN_PROCESS_WORKER !== 'false',
    jpegQuality: int(env.JPEG_QUALITY, 90),
    jobSchema: env.JOB_SCHEMA || 'pgboss',
    jobStaleSeconds: int(env.JOB_STALE_SECONDS, 30),
    clientDist: path.resolve(env.CLIENT_DIST ?? 'dist'),
    logLevel: env.LOG_LEVEL ?? 'info',
    storage: storageSettings(env),
    scratchDir: env.SCRATCH_DIR ? path.resolve(env.SCRATCH_DIR) : null,
    workerConcurrency: Math.max(1, int(env.WORKER_CONCURRENCY, 1)),
    workerStopGraceSeconds: Math.max(0, int(env.WORKER_STOP_GRACE_SECONDS, 20)),
  };
}
