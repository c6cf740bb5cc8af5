import { z } from 'zod';
import { DisplayName, Email, NewPassword, Uuid } from './common';
import { RoleSchema } from './auth';

export const TeamCreateBody = z.object({
  name: z.string().trim().min(2, 'must be at least 2 characters').max(80),
  siteName: z.string().trim().max(120).optional(),
});

export const MemberParams = z.object({ teamId: Uuid, userId: Uuid });
export const MemberRoleBody = z.object({ role: RoleSchema });

export const InvitationCreateBody = z.object({ email: Email, role: RoleSchema });
export const InvitationParams = z.object({ teamId: Uuid, invitationId: Uuid });
export const InvitationTokenParams = z.object({ token: z.string().min(20).max(200) });

/** Accepting: a new person names themselves and picks a password; an existing user proves the password. */
export const InvitationAcceptBody = z.object({
  displayName: DisplayName.optional(),
  password: NewPassword,
});

export const Member = z.object({
  userId: Uuid,
  email: z.string(),
  displayName: z.string(),
  role: RoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof Member>;
