import type { Logger } from './http/logger';
import type pg from 'pg';
import type { Config } from './config';
import type { Db } from './db/client';
import type { Jobs } from './jobs/queue';
import type { Mailer } from './mail/mailer';
import type { Storage } from './storage/storage';

/** What route handlers may use. Built once in server/index.ts (or a test) and handed to createApp. */
export interface AppDeps {
  config: Config;
  db: Db;
  pool: pg.Pool;
  mailer: Mailer;
  /** Clip files and frames (local disk under config.storageDir). */
  storage: Storage;
  /** The job queue, when one is running (background.ts or a test that asks for it). */
  jobs?: Jobs;
  /** Structured logs (pino); by default one at config.logLevel on standard output. */
  logger?: Logger;
}
