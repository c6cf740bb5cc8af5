import type pg from 'pg';
import type { Config } from './config';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';

/** What route handlers may use. Built once in server/index.ts (or a test) and handed to createApp. */
export interface AppDeps {
  config: Config;
  db: Db;
  pool: pg.Pool;
  mailer: Mailer;
}
