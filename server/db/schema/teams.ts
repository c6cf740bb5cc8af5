import { boolean, index, pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teamRole } from './enums';
import { users } from './users';

export const teams = pgTable('teams', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  slug: text('slug').notNull().unique(),
  siteName: text('site_name'),
  /** Automatic marks below this confidence are flagged for review and left out of fits. */
  autoMarkReviewThreshold: real('auto_mark_review_threshold').notNull().default(0.6),
  /** Separation of duties: the person who ran a fit may not approve it. On unless an admin turns it off. */
  separateFitApproval: boolean('separate_fit_approval').notNull().default(true),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: teamRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);
