import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';

export type Db = NodePgDatabase;

/** The handle db.transaction() passes to its callback; defined once so helpers that join a caller's transaction share it. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** What a query helper runs on: the pooled database or a transaction already open (a Tx lacks the pool's `$client`). */
export type DbOrTx = Db | Tx;

export interface Database {
  pool: pg.Pool;
  db: Db;
  close: () => Promise<void>;
}

export function connect(databaseUrl: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: databaseUrl, max });
  // An idle client that loses its connection must not crash the process.
  pool.on('error', (err) => console.error('[db] idle client error:', err.message));
  const db = drizzle(pool, { casing: 'snake_case' });
  return { pool, db, close: () => pool.end() };
}
