import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teams } from './teams';
import { users } from './users';

// Hand-off events waiting for a person's daily digest. Rows of people who want
// one mail per event are never written; a digest run sends and stamps sent_at,
// so running it twice sends nothing twice.
export const pendingNotifications = pgTable(
  'pending_notifications',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [index('pending_notifications_user_idx').on(t.userId, t.sentAt)],
);
