import type { Role } from '../../shared/roles';

declare module 'express-session' {
  interface SessionData {
    userId: string;
  }
}

declare global {
  namespace Express {
    interface Locals {
      user?: { id: string; email: string; displayName: string; notifyByEmail: boolean };
      team?: { id: string; name: string; role: Role };
      input?: unknown;
    }
  }
}

export {};
