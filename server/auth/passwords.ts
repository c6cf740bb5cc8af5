import argon2 from 'argon2';

// OWASP Password Storage Cheat Sheet, argon2id minimum: m = 19 MiB, t = 2, p = 1.
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19 * 1024, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

// Verified against when the e-mail is unknown, so both failures cost the same time.
let dummyHash: Promise<string> | null = null;

export async function verifyPassword(hash: string | null, password: string): Promise<boolean> {
  if (hash === null) {
    dummyHash ??= hashPassword('not-a-real-password-just-for-timing');
    await argon2.verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return argon2.verify(hash, password).catch(() => false);
}
