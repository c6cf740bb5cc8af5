import { z } from 'zod';
import { ROLES } from '../roles';
import { DisplayName, Email, NewPassword, Uuid } from './common';
import { NotificationMode } from './notifications';

export const SignInBody = z.object({
  email: Email,
  password: z.string().min(1, 'is required').max(256),
});
export type SignInBody = z.infer<typeof SignInBody>;

export const RoleSchema = z.enum(ROLES);

export const MeUpdateBody = z
  .object({ displayName: DisplayName, notificationMode: NotificationMode })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');

export const TeamSummary = z.object({ id: Uuid, name: z.string(), slug: z.string(), siteName: z.string().nullable(), role: RoleSchema });

export const Me = z.object({
  id: Uuid,
  email: z.string(),
  displayName: z.string(),
  /** none, each event, or a daily digest (shared/schemas/notifications.ts). */
  notificationMode: NotificationMode,
  teams: z.array(TeamSummary),
});
export type Me = z.infer<typeof Me>;

export { DisplayName, NewPassword };
