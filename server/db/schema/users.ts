import { pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { NotificationMode } from '../../../shared/schemas/notifications';

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  // Stored lower-cased; the unique index is therefore case-insensitive in effect.
  email: text('email').notNull().unique(),
  displayName: text('display_name').notNull(),
  passwordHash: text('password_hash').notNull(),
  /** none, each (one mail per event) or digest (one mail a day); see server/notifications/. */
  notificationMode: text('notification_mode').$type<NotificationMode>().notNull().default('each'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
