import type { User as AccountUser } from '../accounts/user.entity';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    /** Passport puts the signed-in account on `req.user`, loaded fresh from the database each request. */
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AccountUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    /** When the session began (ms since the epoch): sessions end 12 hours after, however active. */
    createdAt: number;
    passport?: { user?: string };
  }
}

export {};
