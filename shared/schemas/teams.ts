import { z } from 'zod';
import { DisplayName, Email, NewPassword, Uuid } from './common';
import { RoleSchema } from './auth';

export const TeamCreateBody = z.object({
  name: z.string().trim().min(2, 'must be at least 2 characters').max(80),
  siteName: z.string().trim().max(120).optional(),
});
export type TeamCreateBody = z.infer<typeof TeamCreateBody>;

/** A team as its member sees it: with their own role and the head count. */
export const TeamView = z.object({
  id: Uuid,
  name: z.string(),
  slug: z.string(),
  siteName: z.string().nullable(),
  role: RoleSchema,
  memberCount: z.number().int(),
  createdAt: z.string(),
});
export type TeamView = z.infer<typeof TeamView>;

export const MemberParams = z.object({ teamId: Uuid, userId: Uuid });
export const MemberRoleBody = z.object({ role: RoleSchema });
export type MemberRoleBody = z.infer<typeof MemberRoleBody>;

export const InvitationCreateBody = z.object({ email: Email, role: RoleSchema });
export type InvitationCreateBody = z.infer<typeof InvitationCreateBody>;
export const InvitationParams = z.object({ teamId: Uuid, invitationId: Uuid });
export const InvitationTokenParams = z.object({ token: z.string().min(20, 'is not an invitation token').max(200) });

/** Accepting: a new person names themselves and picks a password; an existing user proves the password. */
export const InvitationAcceptBody = z.object({
  displayName: DisplayName.optional(),
  password: NewPassword,
});
export type InvitationAcceptBody = z.infer<typeof InvitationAcceptBody>;

export const Member = z.object({
  userId: Uuid,
  email: z.string(),
  displayName: z.string(),
  role: RoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof Member>;

export const INVITATION_STATES = ['pending', 'expired', 'used', 'revoked'] as const;
export const InvitationState = z.enum(INVITATION_STATES);
export type InvitationState = z.infer<typeof InvitationState>;

/** An invitation as a team admin sees it (never with its token). */
export const Invitation = z.object({
  id: Uuid,
  email: z.string(),
  role: RoleSchema,
  state: InvitationState,
  invitedBy: z.string().nullable(),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof Invitation>;

/** What the holder of an invitation link may see before accepting. */
export const InvitationPreview = z.object({
  teamName: z.string(),
  siteName: z.string().nullable(),
  email: z.string(),
  role: RoleSchema,
  state: InvitationState,
  expiresAt: z.string(),
  /** True when the address already has an account: the form then asks only for its password. */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof InvitationPreview>;

export const AuditEvent = z.object({
  id: Uuid,
  action: z.string(),
  actor: z.object({ id: Uuid, displayName: z.string() }).nullable(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof AuditEvent>;

export const AuditPage = z.object({
  items: z.array(AuditEvent),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type AuditPage = z.infer<typeof AuditPage>;
