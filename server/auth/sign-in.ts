import { eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { MeUpdateBody } from '../../shared/schemas/auth';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { users } from '../db/schema/users';
import { unauthorized } from '../http/problem';
import { verifyPassword } from './passwords';

/**
 * Checks e-mail and password, then lets the caller start the session and records the sign-in.
 * Returns the user's id.
 */
export async function signIn(db: Db, body: { email: string; password: string }, startSession: (userId: string) => Promise<void>): Promise<string> {
  const [user] = await db.select({ id: users.id, passwordHash: users.passwordHash }).from(users).where(eq(users.email, body.email));
  const ok = await verifyPassword(user?.passwordHash ?? null, body.password);
  // One message for both failures, so the form does not reveal who has an account.
  if (!user || !ok) throw unauthorized('E-mail or password is not right.');
  await startSession(user.id);
  await audit(db, { actorUserId: user.id, action: 'auth.sign-in' });
  return user.id;
}

/** Changes the user's own name or notification setting. */
export async function updateMe(db: Db, userId: string, changes: z.output<typeof MeUpdateBody>): Promise<void> {
  await db.update(users).set(changes).where(eq(users.id, userId));
}
