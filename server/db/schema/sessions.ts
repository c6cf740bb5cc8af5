import { index, json, pgTable, timestamp, varchar } from 'drizzle-orm/pg-core';

// The table connect-pg-simple expects (its table.sql), owned by our migrations.
export const sessions = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
);
