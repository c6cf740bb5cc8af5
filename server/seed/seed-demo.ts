import { eq } from 'drizzle-orm';
import { hashPassword } from '../auth/passwords';
import type { Db } from '../db/client';
import { memberships, teams } from '../db/schema/teams';
import { users } from '../db/schema/users';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_TEAM } from './demo-people';

export interface SeedStep {
  name: string;
  run: (db: Db, teamId: string) => Promise<void>;
}

/**
 * Seeds the demo team. Idempotent: every insert is keyed on a natural key and
 * skipped when present, so a second start changes nothing. Later areas add
 * their own steps (series, shots, clips, presets) to `extraSteps`.
 */
export async function seedDemo(db: Db, extraSteps: SeedStep[] = []): Promise<{ teamId: string }> {
  const [existing] = await db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  const teamId = existing?.id ?? (await db.insert(teams).values(DEMO_TEAM).returning({ id: teams.id }))[0].id;

  for (const person of DEMO_PEOPLE) {
    const [found] = await db.select({ id: users.id }).from(users).where(eq(users.email, person.email));
    const userId =
      found?.id ??
      (
        await db
          .insert(users)
          .values({ email: person.email, displayName: person.displayName, passwordHash: await hashPassword(DEMO_PASSWORD) })
          .returning({ id: users.id })
      )[0].id;
    await db.insert(memberships).values({ teamId, userId, role: person.role }).onConflictDoNothing();
  }
  for (const step of extraSteps) await step.run(db, teamId);
  return { teamId };
}
