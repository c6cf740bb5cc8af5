import type { Role } from '../../shared/roles';
import type { NotificationMode } from '../../shared/schemas/notifications';

declare module 'express-session' {
  interface SessionData {
    userId: string;
    /** When this sign-in began (ms since epoch): the absolute lifetime counts from here. */
    signedInAt?: number;
    /** The user's memberships and roles when the session id was last issued; a change issues a new id. */
    roleStamp?: string;
  }
}

declare global {
  namespace Express {
    interface Locals {
      user?: { id: string; email: string; displayName: string; notificationMode: NotificationMode };
      team?: { id: string; name: string; role: Role };
      input?: unknown;
      /** Set for every request (X-Request-Id); a 500's log line and answer name it. */
      requestId?: string;
    }
  }
}

export {};
