import { createHash, randomBytes } from 'node:crypto';

export const INVITATION_LIFETIME_MS = 7 * 24 * 3600 * 1000;

/** 32 random bytes (256 bits) from the OS CSPRNG, URL-safe without padding. */
export function newInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Only this digest is stored; the token itself exists only in the e-mail. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
