import type { InvitationState } from '../../shared/schemas/teams';

interface InvitationTimes {
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
}

/** Revoked and used are final and win over expiry, so the message names what really happened. */
export function invitationState(inv: InvitationTimes, now = new Date()): InvitationState {
  if (inv.revokedAt) return 'revoked';
  if (inv.acceptedAt) return 'used';
  if (inv.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'pending';
}
