import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';

export type Db = NodePgDatabase;

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
